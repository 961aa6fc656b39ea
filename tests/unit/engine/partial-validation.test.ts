import { describe, expect, it } from "vitest";
import { validateHardware, validateHardwareText, validateProfile, validateProfileText } from "@/lib/engine";
import { exampleHardware, quietProfile } from "./fixtures";

const codes = (r: { issues: { code: string; path: string }[] }): string[] => r.issues.map((i) => `${i.code} ${i.path}`);

describe("schema errors do not hide the rule errors of the parts that could be read", () => {
  it("a broken fan curve still lets the pump curve's rule errors through, in one pass", () => {
    const p = quietProfile() as unknown as { fans: { points: { dutyPct: unknown }[] }; pump: { points: { tempC: number }[] }; criticalTempC: number };
    p.fans.points[1]!.dutyPct = "forty"; // schema error in the fans
    p.pump.points[2]!.tempC = 35; // rule error in the pump: 35 °C after 35 °C
    const r = validateProfile(p);
    expect(r.ok).toBe(false);
    expect(r.value).toBeUndefined();
    expect(codes(r)).toContain("schema.wrong_type /fans/points/1/dutyPct");
    expect(codes(r)).toContain("curve.temps_not_increasing /pump/points/2/tempC");
    // Nothing is reported from the curve that could not be read.
    expect(r.issues.filter((i) => i.path.startsWith("/fans") && !i.code.startsWith("schema."))).toEqual([]);
  });

  it("a missing property elsewhere does not hide safety errors, with board limits when hardware is given", () => {
    const p = quietProfile() as unknown as Record<string, unknown> & { pump: { points: { dutyPct: number }[] } };
    delete p.name;
    p.sensorLossDutyPct = 80; // below the highest curve duty, 100 %
    p.pump.points[0]!.dutyPct = 20; // below the example pump's 30 % minimum
    const r = validateProfile(p, exampleHardware());
    expect(codes(r)).toEqual(expect.arrayContaining(["schema.missing_property ", "sensor_loss.below_curve_duty /sensorLossDutyPct", "pump.below_min_duty /pump/points/0/dutyPct"]));
  });

  it("an unknown extra property in a curve does not stop that curve's rules", () => {
    const p = quietProfile() as unknown as { pump: Record<string, unknown> & { points: { dutyPct: number }[] } };
    p.pump.stopBelowTempC = 25;
    p.pump.points[0]!.dutyPct = 0;
    const r = validateProfile(p);
    expect(codes(r)).toEqual(expect.arrayContaining(["pump.stop_not_allowed /pump/stopBelowTempC", "pump.zero_duty /pump/points/0/dutyPct"]));
  });

  it("the editor's text validation lists both, each with its place in the text", () => {
    const p = quietProfile() as unknown as { criticalTempC: unknown; fans: { points: { tempC: number }[] } };
    p.criticalTempC = "hot";
    p.fans.points[2]!.tempC = 40; // 40 °C after 40 °C
    const text = JSON.stringify(p, null, 2);
    const r = validateProfileText(text);
    const schema = r.issues.find((i) => i.code === "schema.wrong_type");
    const rule = r.issues.find((i) => i.code === "curve.temps_not_increasing");
    expect(schema?.path).toBe("/criticalTempC");
    expect(rule?.path).toBe("/fans/points/2/tempC");
    // The marker sits on the third fan point's temperature.
    const line = text.split("\n")[(rule?.range?.start.line ?? 0) - 1];
    expect(line).toContain('"tempC": 40');
    expect(rule?.range?.start.line).toBeGreaterThan(text.split("\n").findIndex((l) => l.includes('"fans"')));
  });

  it("hardware: a bad board revision does not hide a radiator or component error", () => {
    const hw = exampleHardware() as unknown as { boardRevision: Record<string, unknown>; radiator: Record<string, number>; fan: Record<string, number> };
    hw.boardRevision.memoryBytes = "lots";
    hw.radiator.thermalResistanceAtMaxFanKPerW = 0.2; // above the 0.075 at minimum speed
    hw.fan.rpmAtMinDuty = 2500; // above maxRpm 2000
    const r = validateHardware(hw);
    expect(codes(r)).toEqual(
      expect.arrayContaining(["schema.wrong_type /boardRevision/memoryBytes", "radiator.resistance_order /radiator/thermalResistanceAtMaxFanKPerW", "component.rpm_order /fan/rpmAtMinDuty"]),
    );
    expect(validateHardwareText(JSON.stringify(hw)).issues.map((i) => i.code)).toContain("radiator.resistance_order");
  });
});
