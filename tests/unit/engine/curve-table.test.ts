import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { coolerTotalDbA1m, dutyAtTemp, evaluateCurves, fanStateAt, pumpStateAt, validateProfile, type CurvePoint, type HardwareContext } from "@/lib/engine";
import { CurveReader } from "@/lib/speeds/curve";
import { anyInRangeProfileArb, exampleHardware, hardwareArb, validProfileArb } from "./fixtures";

// The curve table is computed in one pass (the curves walked once, repeated speeds summed once);
// these checks hold it to the functions that define each value, row by row, bit for bit.

/** Temperatures a table or sweep asks for: rising, then falling back, then jumping about. */
function temperatureRuns(seed: number): number[] {
  const rising = Array.from({ length: 61 }, (_, i) => 15 + i * 1.5);
  const jumping = Array.from({ length: 40 }, (_, i) => ((i * 37 + seed) % 101) - 0.25 * (i % 3));
  return [...rising, ...[...rising].reverse(), ...jumping, Number.NaN, Infinity, -Infinity, 45];
}

describe("CurveReader", () => {
  it("answers as dutyAtTemp for any order of temperatures, on valid curves and on curves out of order", () => {
    const curves = fc.oneof(
      validProfileArb.map((p) => p.fans.points),
      anyInRangeProfileArb.map((p) => p.pump.points),
    );
    fc.assert(
      fc.property(curves, fc.nat(100), (points: CurvePoint[], seed) => {
        // Realistic sizes: a board stores at most 32 points a curve.
        expect(points.length).toBeGreaterThanOrEqual(1);
        expect(points.length).toBeLessThanOrEqual(32);
        const reader = new CurveReader(points);
        for (const t of temperatureRuns(seed)) expect(Object.is(reader.dutyAt(t), dutyAtTemp(points, t))).toBe(true);
      }),
      { numRuns: 300 },
    );
  });

  it("agrees with dutyAtTemp where two points share a temperature", () => {
    const points = [
      { tempC: 30, dutyPct: 20 },
      { tempC: 40, dutyPct: 50 },
      { tempC: 40, dutyPct: 80 },
      { tempC: 50, dutyPct: 100 },
    ];
    const reader = new CurveReader(points);
    for (const t of [29, 35, 40, 40.5, 45, 60, 40, 35]) expect(reader.dutyAt(t)).toBe(dutyAtTemp(points, t));
    expect(reader.dutyAt(40)).toBe(50);
  });
});

describe("evaluateCurves in one pass", () => {
  /** The example fan that keeps its minimum speed, with a measured sound table instead of the law. */
  const holdingFanWithTable = (): HardwareContext => {
    const hw = exampleHardware();
    hw.fan.stopsAtZeroDuty = false;
    hw.fan.soundTable = {
      distanceM: 1,
      points: [
        { rpm: 500, soundDbA: 14 },
        { rpm: 1200, soundDbA: 24 },
        { rpm: 2000, soundDbA: 33 },
      ],
    };
    return hw;
  };

  const sameRows = (profile: Parameters<typeof evaluateCurves>[0], hw: HardwareContext, stepC: number): void => {
    const rows = evaluateCurves(profile, hw, { fromC: 10, toC: 90, stepC, distanceM: 2 });
    expect(rows.length).toBe(Math.floor(80 / stepC + 1e-9) + 1);
    for (const row of rows) {
      const pump = pumpStateAt(profile, hw, row.tempC);
      const fans = fanStateAt(profile, hw, row.tempC);
      const total = coolerTotalDbA1m(hw, fans.rpm, pump.rpm);
      expect(row).toEqual({
        tempC: row.tempC,
        pumpDutyPct: pump.dutyPct,
        pumpRpm: pump.rpm,
        fanDutyPct: fans.dutyPct,
        fanRpm: fans.rpm,
        fansStopped: fans.stopped,
        soundDbA1m: total,
        soundDbAAtDistance: total - 20 * Math.log10(2),
      });
    }
  };

  it("gives, row by row, what pumpStateAt, fanStateAt and coolerTotalDbA1m give at that temperature", () => {
    fc.assert(
      fc.property(fc.oneof(validProfileArb, anyInRangeProfileArb), fc.constantFrom(0.5, 1, 2.5), (profile, stepC) => {
        expect(profile.pump.points.length).toBeLessThanOrEqual(32);
        sameRows(profile, exampleHardware(), stepC);
        sameRows(profile, holdingFanWithTable(), stepC);
      }),
      { numRuns: 150 },
    );
  });

  it("does so on any sensible hardware, fans stopping or not", () => {
    fc.assert(
      fc.property(validProfileArb, hardwareArb, fc.boolean(), (profile, hw, stops) => {
        hw.fan.stopsAtZeroDuty = stops;
        expect(hw.fanCount).toBeGreaterThanOrEqual(1);
        expect(hw.fanCount).toBeLessThanOrEqual(12);
        sameRows(profile, hw, 1);
      }),
      { numRuns: 100 },
    );
  });
});

describe("hostile-value walk", () => {
  it("lists non-finite values with array items first to last and object members last to first, at most 20", () => {
    const doc = { a: Number.NaN, b: [Infinity, { c: -Infinity, d: Number.NaN }], e: Number.NaN };
    const paths = validateProfile(doc).issues.map((i) => `${i.code} ${i.path}`);
    expect(paths).toEqual(["value.not_finite /e", "value.not_finite /b/0", "value.not_finite /b/1/d", "value.not_finite /b/1/c", "value.not_finite /a"]);
    const many = { values: Array.from({ length: 100 }, () => Number.NaN) };
    const issues = validateProfile(many).issues;
    expect(issues).toHaveLength(20);
    expect(issues[19]!.path).toBe("/values/19");
  });
});
