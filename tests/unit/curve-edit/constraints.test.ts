import { describe, expect, it } from "vitest";
import { clampToBound, fanStopBound, newPointAt, pointDutyBound, pointTempBound, pointValueText, removalRefusal } from "@/lib/curve-edit";
import { exampleHardware, quietProfile } from "../engine/fixtures";

/*
 * The rules come from the profile schema's own descriptions (schemas/cooling-profile.schema.json:
 * temperatures strictly increase, duties never fall, 0–100, stored in 0.5 steps) and from the
 * trade's common practice that a pump must never run below its rated minimum duty.
 */
describe("point limits", () => {
  const hw = exampleHardware(); // pump minimum duty 30 % (examples/cooler-360.hardware.json)
  const points = [
    { tempC: 25, dutyPct: 35 },
    { tempC: 40, dutyPct: 60 },
    { tempC: 55, dutyPct: 100 },
  ];

  it("stops a pump point at the pump's minimum duty and says why", () => {
    const bound = pointDutyBound(points, "pump", 0, hw);
    const clamped = clampToBound(10, bound, 35);
    expect(clamped.value).toBe(30);
    expect(clamped.reason).toMatch(/pump's minimum duty 30 %/);
  });

  it("lets a fan point go to 0 % but not above the next point's duty", () => {
    expect(clampToBound(-5, pointDutyBound(points, "fans", 0, hw), 35).value).toBe(0);
    const up = clampToBound(80, pointDutyBound(points, "fans", 0, hw), 35);
    expect(up.value).toBe(60);
    expect(up.reason).toMatch(/fan point 2/);
  });

  it("keeps temperatures at least one stored step apart", () => {
    const bound = pointTempBound(points, "fans", 1);
    expect(clampToBound(10, bound, 40)).toMatchObject({ value: 25.5 });
    expect(clampToBound(70, bound, 40)).toMatchObject({ value: 54.5 });
    expect(clampToBound(45, bound, 40)).toEqual({ value: 45 });
  });

  it("never makes a handle jump when the draft already breaks a rule", () => {
    // A pump point at 10 % (below the 30 % minimum): raising it is allowed, lowering it further is not.
    const bad = [{ tempC: 25, dutyPct: 10 }, ...points.slice(1)];
    const bound = pointDutyBound(bad, "pump", 0, hw);
    expect(clampToBound(12, bound, 10)).toEqual({ value: 12 });
    expect(clampToBound(5, bound, 10).value).toBe(10);
  });

  it("keeps the fan stop temperature below the critical temperature", () => {
    const profile = quietProfile();
    const clamped = clampToBound(profile.criticalTempC + 5, fanStopBound(profile));
    expect(clamped.value).toBe(profile.criticalTempC - 0.5);
    expect(clamped.reason).toMatch(/critical/);
  });
});

describe("adding and removing points", () => {
  const points = [
    { tempC: 25, dutyPct: 20 },
    { tempC: 40, dutyPct: 60 },
    { tempC: 45, dutyPct: 100 },
  ];

  it("adds at a temperature on the curve as it is, on the stored grid", () => {
    // Linear interpolation between (25, 20) and (40, 60) at 30.2 °C → 30 °C: 20 + 40·5/15 = 33.33 → 33.5 % (next 0.5 step up).
    expect(newPointAt(points, "fans", 16, 30.2)).toEqual({ ok: true, index: 1, point: { tempC: 30, dutyPct: 33.5 } });
  });

  it("without a temperature, adds in the middle of the widest gap", () => {
    expect(newPointAt(points, "fans", 16)).toEqual({ ok: true, index: 1, point: { tempC: 32.5, dutyPct: 40 } });
  });

  it("refuses a point where there is no room, and past the board's point limit", () => {
    expect(newPointAt(points, "fans", 16, 40.2)).toMatchObject({ ok: false });
    const full = newPointAt(points, "pump", 3, 30);
    expect(full).toMatchObject({ ok: false });
    if (!full.ok) expect(full.reason).toMatch(/most this board revision stores \(3\)/);
  });

  it("keeps at least two points", () => {
    expect(removalRefusal(points.slice(0, 2), "pump")).toMatch(/at least 2 points/);
    expect(removalRefusal(points, "pump")).toBeNull();
  });

  it("announces handles counting from 1", () => {
    expect(pointValueText("pump", 2, { tempC: 45, dutyPct: 60 })).toBe("pump point 3, 45 °C, 60 %");
  });
});
