import { describe, expect, it } from "vitest";
import { dutyToRpm, evaluateCurves, fanStateAt, operatingPoint, simulateTransient, validateHardware, validateProfile, type CoolingProfile, type HardwareContext } from "@/lib/engine";
import { flashedStateAt, slotCodes } from "@/lib/firmware";
import { exampleHardware, quietProfile } from "./fixtures";

/*
 * Intel, "4-Wire Pulse Width Modulation (PWM) Controlled Fans", rev. 1.3, §3.4 allows two
 * kinds of fan below the minimum duty: one that keeps turning at its minimum speed (0 %
 * included) and one that stops at 0 % duty. The example fan (min 20 %, 500 RPM at min,
 * 2000 RPM at 100 %) is declared to stop; `holding` is the same fan keeping its speed.
 */
const stopping = (): HardwareContext => exampleHardware();
const holding = (): HardwareContext => {
  const hw = exampleHardware();
  return { ...hw, fan: { ...hw.fan, stopsAtZeroDuty: false } };
};
const found = (r: { issues: { code: string; path: string; severity: string }[] }): string[] => r.issues.map((i) => `${i.severity} ${i.code} ${i.path}`);
const edit = (fn: (p: CoolingProfile) => void): CoolingProfile => {
  const p = quietProfile();
  fn(p);
  return p;
};

describe("duty → RPM below the minimum duty, both kinds of fan (4-wire PWM fan spec rev. 1.3 §3.4)", () => {
  it("above the minimum both follow the duty linearly: 60 % → 500 + 1500·40/80 = 1250 RPM (worked by hand)", () => {
    expect(dutyToRpm(60, stopping().fan)).toBeCloseTo(1250, 9);
    expect(dutyToRpm(60, holding().fan)).toBeCloseTo(1250, 9);
  });
  it("a fan that keeps its minimum speed turns at 500 RPM at 10 % and at 0 %", () => {
    expect(dutyToRpm(10, holding().fan)).toBe(500);
    expect(dutyToRpm(0, holding().fan)).toBe(500);
  });
  it("a fan that stops at 0 % duty turns at 500 RPM at 10 % and stands still at 0 %", () => {
    expect(dutyToRpm(10, stopping().fan)).toBe(500);
    expect(dutyToRpm(0, stopping().fan)).toBe(0);
  });
  it("leaving the declaration out means keeping the minimum speed (the hardware context's default)", () => {
    const { stopsAtZeroDuty: _drop, ...fan } = stopping().fan;
    expect(dutyToRpm(0, fan)).toBe(500);
  });
});

describe("the profile's fan stop on each kind of fan", () => {
  const p = quietProfile(); // fans stop below 30 °C, hysteresis 1.5 °C

  it("steady state: a stopping fan stands still below 30 °C, a holding fan keeps 500 RPM there", () => {
    expect(fanStateAt(p, stopping(), 25)).toEqual({ dutyPct: 0, rpm: 0, stopped: true });
    expect(fanStateAt(p, holding(), 25)).toEqual({ dutyPct: 0, rpm: 500, stopped: false });
    const rows = evaluateCurves(p, holding(), { fromC: 20, toC: 20 });
    expect(rows[0]!.fansStopped).toBe(false);
    expect(rows[0]!.fanRpm).toBe(500);
  });

  it("as flashed (the firmware's integer law outputs 0 %): 0 RPM on a stopping fan, 500 RPM on a holding fan", () => {
    const codes = slotCodes(p);
    expect(flashedStateAt(codes, stopping(), 25)).toMatchObject({ fanDutyPct: 0, fanRpm: 0, fansStopped: true });
    expect(flashedStateAt(codes, holding(), 25)).toMatchObject({ fanDutyPct: 0, fanRpm: 500, fansStopped: true });
  });

  it("transient: the same trace stops one fan and leaves the other at its minimum speed", () => {
    const trace = [
      { tSec: 0, tempC: 35 },
      { tSec: 1, tempC: 27 }, // below 30 − 1.5: the fan stop applies
    ];
    const a = simulateTransient(p, stopping(), trace);
    const b = simulateTransient(p, holding(), trace);
    expect(a[1]!.fans).toMatchObject({ dutyPct: 0, rpm: 0, stopped: true });
    expect(b[1]!.fans).toMatchObject({ dutyPct: 0, rpm: 500, stopped: false });
  });

  it("thermal: 40 W at 25 °C settles at 30 °C on the stop step with a stopping fan, at 28 °C with a holding one", () => {
    // Worked by hand: a holding fan never stops, so R stays at its minimum-speed value
    // 0.075 K/W: T = 25 + 40 × 0.075 = 28.0 °C (below the stop temperature, fans at 500 RPM).
    const held = operatingPoint(p, holding(), { heatLoadW: 40, ambientC: 25 });
    expect(held.liquidTempC).toBeCloseTo(28, 2);
    expect(held.fans.rpm).toBe(500);
    // With fans stopped R = 0.25 K/W → 35 °C, running 28 °C: the liquid sits on the 30 °C step.
    expect(operatingPoint(p, stopping(), { heatLoadW: 40, ambientC: 25 }).liquidTempC).toBeCloseTo(30, 2);
  });
});

describe("rules for fans below their minimum duty", () => {
  it("a 0 % point on a fan that stops at 0 % duty without a fan stop temperature is an error, with the point counted from 1", () => {
    const r = validateProfile(
      edit((p) => {
        delete p.fans.stopBelowTempC;
        p.fans.points[0]!.dutyPct = 0;
      }),
      stopping(),
    );
    expect(found(r)).toContain("error fans.zero_duty_stops_fan /fans/points/0/dutyPct");
    expect(r.ok).toBe(false);
    const issue = r.issues.find((i) => i.code === "fans.zero_duty_stops_fan")!;
    expect(issue.message).toMatch(/^Fan point 1 asks for 0 %, and this fan stops at 0 % duty: the fans would stop at 30 °C without a fan stop temperature/);
    expect(issue.message).toMatch(/Set stopBelowTempC/);
  });

  it("with a fan stop temperature: a 0 % point below it is fine, at or above it is an error", () => {
    const below = validateProfile(
      edit((p) => {
        p.fans.points.unshift({ tempC: 25, dutyPct: 0 });
      }),
      stopping(),
    );
    expect(found(below).filter((c) => c.includes("zero_duty_stops_fan"))).toEqual([]);
    expect(below.ok).toBe(true);
    const above = validateProfile(
      edit((p) => {
        p.fans.points[0]!.dutyPct = 0; // 30 °C, and the fans stop only below 30 °C
      }),
      stopping(),
    );
    expect(found(above)).toContain("error fans.zero_duty_stops_fan /fans/points/0/dutyPct");
    expect(above.issues.find((i) => i.code === "fans.zero_duty_stops_fan")!.message).toMatch(/^Fan point 1 asks for 0 % at 30 °C, at or above the fan stop temperature 30 °C/);
  });

  it("a 0 % point on a fan that keeps its minimum speed is only the below-minimum warning", () => {
    const r = validateProfile(
      edit((p) => {
        delete p.fans.stopBelowTempC;
        p.fans.points[0]!.dutyPct = 0;
      }),
      holding(),
    );
    expect(found(r)).toContain("warning fans.below_min_duty /fans/points/0/dutyPct");
    expect(found(r).filter((c) => c.startsWith("error"))).toEqual([]);
    expect(r.issues.find((i) => i.code === "fans.below_min_duty")!.message).toMatch(/^Fan point 1: 0 % is below the fan's minimum duty 20 %, so the fans hold their minimum 500 RPM there\. Raise it; this fan does not stop at 0 % duty\.$/);
  });

  it("a fan stop temperature on a fan that keeps its minimum speed is a warning saying it will not stop", () => {
    const r = validateProfile(quietProfile(), holding());
    expect(found(r)).toContain("warning fans.stop_on_fan_that_holds_speed /fans/stopBelowTempC");
    expect(r.ok).toBe(true);
    expect(r.issues.find((i) => i.code === "fans.stop_on_fan_that_holds_speed")!.message).toMatch(/below 30 °C they run at 500 RPM, not stopped/);
    expect(found(validateProfile(quietProfile(), stopping())).filter((c) => c.includes("stop_on_fan_that_holds_speed"))).toEqual([]);
  });

  it("a fan stop with hysteresis 0 still warns of chatter on either kind", () => {
    for (const hw of [stopping(), holding()]) {
      expect(found(validateProfile(edit((p) => (p.fans.hysteresisC = 0)), hw))).toContain("warning fans.stop_without_hysteresis /fans/hysteresisC");
    }
  });

  it("the hardware context's schema takes the declaration as a boolean only", () => {
    const hw = exampleHardware() as unknown as { fan: Record<string, unknown> };
    hw.fan.stopsAtZeroDuty = "yes";
    const r = validateHardware(hw);
    expect(r.ok).toBe(false);
    expect(r.issues.some((i) => i.path === "/fan/stopsAtZeroDuty")).toBe(true);
  });
});
