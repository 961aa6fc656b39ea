import { describe, expect, it } from "vitest";
import { pointerToRange, validateHardware, validateHardwareText, validateProfile, validateProfileText, type CoolingProfile } from "@/lib/engine";
import { exampleHardware, quietProfile, readExample } from "./fixtures";

const codes = (r: { issues: { code: string; path: string }[] }): string[] => r.issues.map((i) => `${i.code} ${i.path}`);
const errorCodes = (r: { issues: { code: string; severity: string }[] }): string[] => r.issues.filter((i) => i.severity === "error").map((i) => i.code);
const edit = (fn: (p: CoolingProfile) => void): CoolingProfile => {
  const p = quietProfile();
  fn(p);
  return p;
};

describe("profile validation: examples", () => {
  it("accepts both example profiles with the example hardware", () => {
    const hw = exampleHardware();
    for (const f of ["quiet.profile.json", "performance.profile.json"]) {
      const r = validateProfileText(readExample(f), hw);
      expect(r.issues).toEqual([]);
      expect(r.ok).toBe(true);
      expect(r.value?.formatVersion).toBe(1);
    }
    expect(validateHardwareText(readExample("cooler-360.hardware.json")).issues).toEqual([]);
  });
});

describe("profile validation: semantic rules", () => {
  const hw = exampleHardware();

  it("temperatures must strictly increase", () => {
    const r = validateProfile(edit((p) => (p.pump.points[2]!.tempC = 35)));
    expect(codes(r)).toContain("curve.temps_not_increasing /pump/points/2/tempC");
    // Tools get the 0-based JSON pointer; people read the third point as "point 3".
    const issue = r.issues.find((i) => i.code === "curve.temps_not_increasing")!;
    expect(issue.message).toMatch(/^pump point 3 is at 35 °C, not above point 2 at /);
    expect(r.ok).toBe(false);
  });

  it("duties must not decrease", () => {
    const r = validateProfile(edit((p) => (p.fans.points[2]!.dutyPct = 30)));
    expect(codes(r)).toContain("curve.duties_decreasing /fans/points/2/dutyPct");
    expect(r.issues.find((i) => i.code === "curve.duties_decreasing")!.message).toMatch(/^fan point 3 asks for 30 %, less than the .* % of point 2:/);
  });

  it("duty must be 0–100", () => {
    expect(codes(validateProfile(edit((p) => (p.fans.points[3]!.dutyPct = 101))))).toContain("curve.duty_out_of_range /fans/points/3/dutyPct");
    expect(codes(validateProfile(edit((p) => (p.fans.points[0]!.dutyPct = -1))))).toContain("curve.duty_out_of_range /fans/points/0/dutyPct");
  });

  it("pump never below its minimum duty, never 0, never with a stop temperature", () => {
    expect(codes(validateProfile(edit((p) => (p.pump.points[0]!.dutyPct = 20)), hw))).toContain("pump.below_min_duty /pump/points/0/dutyPct");
    expect(codes(validateProfile(edit((p) => (p.pump.points[0]!.dutyPct = 0))))).toContain("pump.zero_duty /pump/points/0/dutyPct");
    const withStop = edit((p) => ((p.pump as unknown as Record<string, unknown>).stopBelowTempC = 25));
    expect(codes(validateProfile(withStop))).toContain("pump.stop_not_allowed /pump/stopBelowTempC");
  });

  it("100 % at or before the critical temperature", () => {
    const r = validateProfile(edit((p) => (p.criticalTempC = 50)));
    expect(codes(r)).toContain("curve.no_full_speed_at_critical /pump/points");
    expect(codes(r)).toContain("curve.no_full_speed_at_critical /fans/points");
    expect(r.issues.find((i) => i.path === "/pump/points")!.message).toMatch(/85 %.*50 °C/);
  });

  it("sensor-loss duty at least the highest curve duty", () => {
    expect(codes(validateProfile(edit((p) => (p.sensorLossDutyPct = 90))))).toContain("sensor_loss.below_curve_duty /sensorLossDutyPct");
  });

  it("point count within the board revision's limit, image within its memory", () => {
    const small = { ...hw, boardRevision: { ...hw.boardRevision, maxPointsPerCurve: 3, memoryBytes: 40 } };
    const r = validateProfile(quietProfile(), small);
    expect(codes(r)).toContain("board.too_many_points /pump/points");
    expect(codes(r)).toContain("board.too_many_points /fans/points");
    expect(codes(r)).toContain("bank.exceeds_memory ");
  });

  it("warns about quantisation loss, errors when points collide", () => {
    const r = validateProfile(edit((p) => (p.fans.points[1]!.dutyPct = 40.2)));
    expect(r.ok).toBe(true);
    expect(r.issues).toContainEqual(expect.objectContaining({ code: "quantisation.loss", path: "/fans/points/1/dutyPct", severity: "warning" }));
    const collide = validateProfile(edit((p) => (p.pump.points[1]!.tempC = 20.2)));
    expect(codes(collide)).toContain("quantisation.temps_collide /pump/points/1/tempC");
  });

  it("fan stop must be below the critical temperature; fan duty below min is a warning", () => {
    expect(codes(validateProfile(edit((p) => (p.fans.stopBelowTempC = 60))))).toContain("fans.stop_at_or_above_critical /fans/stopBelowTempC");
    const r = validateProfile(edit((p) => (p.fans.points[0]!.dutyPct = 10)), hw);
    expect(r.issues).toContainEqual(expect.objectContaining({ code: "fans.below_min_duty", severity: "warning" }));
  });

  it("every message says how to fix", () => {
    const r = validateProfile(edit((p) => {
      p.pump.points[2]!.tempC = 35;
      p.sensorLossDutyPct = 50;
    }), hw);
    for (const i of r.issues) expect(i.message.length).toBeGreaterThan(20);
  });
});

describe("profile validation: hostile input never throws", () => {
  it("wrong types and missing fields", () => {
    for (const doc of [null, 42, "text", [], {}, { formatVersion: "1" }, { pump: { points: "many" } }, true]) {
      const r = validateProfile(doc);
      expect(r.ok).toBe(false);
      expect(r.issues.length).toBeGreaterThan(0);
    }
    expect(codes(validateProfile(edit((p) => ((p as unknown as Record<string, unknown>).criticalTempC = "hot"))))).toContain("schema.wrong_type /criticalTempC");
  });

  it("NaN and Infinity", () => {
    expect(codes(validateProfile(edit((p) => (p.criticalTempC = Number.NaN))))).toEqual(["value.not_finite /criticalTempC"]);
    expect(codes(validateProfile(edit((p) => (p.pump.points[0]!.dutyPct = Infinity))))).toEqual(["value.not_finite /pump/points/0/dutyPct"]);
    const r = validateProfileText('{"criticalTempC": NaN}');
    expect(r.issues[0]!.code).toBe("json.syntax");
    expect(r.issues[0]!.message).toMatch(/Line 1, column 19.*NaN and Infinity are not JSON/);
  });

  it("10,000 points", () => {
    const p = quietProfile();
    p.fans.points = Array.from({ length: 10_000 }, (_, i) => ({ tempC: i / 200, dutyPct: 50 }));
    const started = performance.now();
    const r = validateProfileText(JSON.stringify(p));
    expect(performance.now() - started).toBeLessThan(2000);
    expect(codes(r)).toContain("curve.too_many_points /fans/points");
  });

  it("deep nesting, as text and as an object, and cycles", () => {
    const deep = `${"[".repeat(100_000)}${"]".repeat(100_000)}`;
    const r = validateProfileText(deep);
    expect(r.issues[0]!.code).toBe("json.syntax");
    expect(r.issues[0]!.message).toMatch(/Nesting deeper/);
    let obj: unknown = 1;
    for (let i = 0; i < 5000; i++) obj = { a: obj };
    expect(codes(validateProfile(obj))[0]).toMatch(/^json.too_deep/);
    const cyclic: Record<string, unknown> = { name: "x" };
    cyclic.self = cyclic;
    expect(codes(validateProfile(cyclic))[0]).toMatch(/^json.too_deep/);
  });

  it("__proto__ keys are reported, not obeyed", () => {
    const r = validateProfileText('{"__proto__": {"criticalTempC": 1}, "formatVersion": 1}');
    expect(codes(r)).toContain("schema.unknown_property /__proto__");
    expect(({} as Record<string, unknown>).criticalTempC).toBeUndefined();
  });

  it("non-text, huge text, empty text", () => {
    expect(validateProfileText(undefined as unknown as string).issues[0]!.code).toBe("json.not_text");
    expect(validateProfileText(" ".repeat(1_000_001)).issues[0]!.code).toBe("json.too_large");
    expect(validateProfileText("").issues[0]!.code).toBe("json.syntax");
  });
});

describe("text positions", () => {
  const text = readExample("quiet.profile.json");

  it("syntax errors carry line and column", () => {
    const broken = text.replace('"dutyPct": 50 },', '"dutyPct": 50 }');
    const r = validateProfileText(broken);
    const issue = r.issues[0]!;
    expect(issue.code).toBe("json.syntax");
    const lines = broken.split("\n");
    const line = lines.findIndex((l) => l.includes('"tempC": 45')) + 1;
    const column = lines[line - 1]!.indexOf("{") + 1;
    expect(issue.range!.start).toEqual({ line, column });
    expect(issue.message.startsWith(`Line ${line}, column ${column}: Expected "," or "]" after an array item, found "{ "tempC"`)).toBe(true);
  });

  it("semantic issues carry the range of their pointer", () => {
    const changed = text.replace('"criticalTempC": 60', '"criticalTempC": 50');
    const r = validateProfileText(changed);
    const issue = r.issues.find((i) => i.code === "curve.no_full_speed_at_critical")!;
    const line = changed.split("\n").findIndex((l) => l.includes('"points"')) + 1;
    expect(issue.range!.start.line).toBe(line);
  });

  it("pointerToRange maps pointers, falls back to the nearest ancestor", () => {
    const lines = text.split("\n");
    const lineOf = (needle: string): number => lines.findIndex((l) => l.includes(needle)) + 1;
    const r = pointerToRange(text, "/fans/stopBelowTempC")!;
    expect(r.start.line).toBe(lineOf('"stopBelowTempC"'));
    expect(lines[r.start.line - 1]!.slice(r.start.column - 1, r.end.column - 1)).toBe("30");
    expect(pointerToRange(text, "/fans/nope")!.start.line).toBe(lineOf('"fans"'));
    expect(pointerToRange("{ broken", "/a")).toBeNull();
  });

  it("duplicate keys are a warning at the later key", () => {
    const r = validateProfileText(text.replace('"criticalTempC": 60,', '"criticalTempC": 60, "criticalTempC": 60,'));
    expect(r.issues).toContainEqual(expect.objectContaining({ code: "json.duplicate_key", severity: "warning", path: "/criticalTempC" }));
  });
});

describe("hardware validation", () => {
  it("checks orderings and kinds, warns about PWM frequency", () => {
    const hw = exampleHardware();
    hw.fan.rpmAtMinDuty = 3000;
    hw.pump.kind = "fan" as "pump";
    hw.radiator.thermalResistanceAtMaxFanKPerW = 0.2;
    hw.boardRevision.pwmFrequencyHz = 1000;
    const r = validateHardware(hw);
    expect(codes(r)).toEqual(
      expect.arrayContaining([
        "component.rpm_order /fan/rpmAtMinDuty",
        "component.wrong_kind /pump/kind",
        "radiator.resistance_order /radiator/thermalResistanceAtMaxFanKPerW",
        "board.pwm_frequency_outside_fan_spec /boardRevision/pwmFrequencyHz",
      ]),
    );
    expect(errorCodes(r)).not.toContain("board.pwm_frequency_outside_fan_spec");
  });

  it("requires the pump's flow and a semver board revision", () => {
    const hw = exampleHardware() as unknown as { pump: Record<string, unknown>; boardRevision: Record<string, unknown> };
    delete hw.pump.flowAtMaxRpmLpm;
    hw.boardRevision.version = "v2";
    expect(codes(validateHardware(hw))).toEqual(expect.arrayContaining(["schema.missing_property /pump", "schema.bad_format /boardRevision/version"]));
  });
});
