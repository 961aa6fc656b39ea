import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  componentLevelDbA,
  coolerNoise,
  coolerTotalDbA1m,
  EngineInputError,
  evaluateCurves,
  listenerDistanceProblem,
  operatingPoint,
  soundTableDbA,
  validateHardware,
  type HardwareContext,
  type MotorComponent,
} from "@/lib/engine";
import { exampleHardware, quietProfile } from "./fixtures";

const table = { distanceM: 1, points: [{ rpm: 1000, soundDbA: 30 }, { rpm: 2000, soundDbA: 45 }, { rpm: 4000, soundDbA: 51 }] };

describe("measured sound table: linear in dB over log RPM, clamped at its ends", () => {
  it("gives the measured levels at the measured speeds", () => {
    expect(soundTableDbA(table, 1000)).toBe(30);
    expect(soundTableDbA(table, 2000)).toBe(45);
    expect(soundTableDbA(table, 4000)).toBe(51);
  });

  it("halfway in log RPM is halfway in dB: √2·1000 = 1414.2 RPM → 37.5 dB, √2·2000 → 48 dB (worked by hand)", () => {
    expect(soundTableDbA(table, 1000 * Math.SQRT2)).toBeCloseTo(37.5, 9);
    expect(soundTableDbA(table, 2000 * Math.SQRT2)).toBeCloseTo(48, 9);
    // A quarter of the way in log RPM (1000·2^0.25 = 1189.2 RPM) is a quarter of the 15 dB step.
    expect(soundTableDbA(table, 1189.207)).toBeCloseTo(33.75, 3);
  });

  it("holds the end levels outside the measured range (clamped, not extrapolated); silent when stopped", () => {
    expect(soundTableDbA(table, 500)).toBe(30);
    expect(soundTableDbA(table, 8000)).toBe(51);
    expect(soundTableDbA(table, 0)).toBe(-Infinity);
  });

  it("a two-point table of a 50·log10 law reproduces that law between its points", () => {
    // Fan law for sound power, +50·log10(N2/N1) (ASHRAE Handbook — HVAC Systems and Equipment,
    // 2020, ch. 21 "Fans", fan-law table; from memory): doubling the speed adds 15.05 dB, so a
    // table 30 dB @ 1000, 45.05 dB @ 2000 gives 30 + 50·log10(1.5) = 38.80 dB at 1500 RPM.
    const law = { distanceM: 1, points: [{ rpm: 1000, soundDbA: 30 }, { rpm: 2000, soundDbA: 45.05 }] };
    expect(soundTableDbA(law, 1500)).toBeCloseTo(38.8, 2);
  });

  it("moves a table measured at 0.5 m to 1 m by the inverse-square law: −6.02 dB (common practice)", () => {
    const fan: MotorComponent = { ...exampleHardware().fan, soundTable: { distanceM: 0.5, points: [{ rpm: 500, soundDbA: 20 }, { rpm: 2000, soundDbA: 40 }] } };
    expect(componentLevelDbA(fan, 2000)).toBeCloseTo(33.98, 2);
    expect(componentLevelDbA(fan, 500)).toBeCloseTo(13.98, 2);
  });

  it("replaces the reference level and exponent: the example pump reads its table (17 dB(A) at 1200 RPM), not the power law's 5.6", () => {
    const hw = exampleHardware();
    expect(componentLevelDbA(hw.pump, 1200)).toBe(17);
    // The fallback for the same pump would be 24 + 50·log10(1200/2800) = 24 − 18.40 = 5.60 dB(A) (worked by hand).
    const { soundTable: _t, ...fallback } = hw.pump;
    expect(componentLevelDbA(fallback, 1200)).toBeCloseTo(5.6, 2);
  });

  it("cooler total: two fans and a pump each at 30.00 dB, then at 2 m (logarithmic sum and inverse square, common practice)", () => {
    // Worked by hand: each fan 30 dB(A) at 1 m (table), two fans 30 + 3.01 = 33.01; the pump
    // 30 dB(A); three equal incoherent sources 30 + 10·log10(3) = 34.77 dB(A); at 2 m −6.02 → 28.75.
    const base = exampleHardware();
    const flat = { distanceM: 1, points: [{ rpm: 500, soundDbA: 30 }, { rpm: 3000, soundDbA: 30 }] };
    const hw: HardwareContext = { ...base, fanCount: 2, fan: { ...base.fan, soundTable: flat }, pump: { ...base.pump, soundTable: flat } };
    const n = coolerNoise(hw, 1500, 1500, 2);
    expect(n.fansDbA).toBeCloseTo(33.01, 2);
    expect(n.totalDbA1m).toBeCloseTo(34.77, 2);
    expect(n.totalDbAAtDistance).toBeCloseTo(28.75, 2);
    // The plotted table sums the same way.
    const rows = evaluateCurves(quietProfile(), hw, { fromC: 45, toC: 45, distanceM: 2 });
    expect(rows[0]!.soundDbA1m).toBeCloseTo(34.77, 2);
    expect(rows[0]!.soundDbAAtDistance).toBeCloseTo(28.75, 2);
  });
});

describe("sound table in the power-domain sum", () => {
  it("property: the plotted total (one power per segment) equals the dB-domain sum for tables of up to 64 points", () => {
    const tableArb = fc
      .array(fc.record({ dRpm: fc.integer({ min: 1, max: 400 }), soundDbA: fc.double({ min: 0, max: 90, noNaN: true }) }), { minLength: 2, maxLength: 64, size: "max" })
      .map((steps) => {
        let rpm = 100;
        return { distanceM: 1.5, points: steps.map((s) => ({ rpm: (rpm += s.dRpm), soundDbA: s.soundDbA })) };
      });
    const lengths: number[] = [];
    fc.assert(
      fc.property(tableArb, tableArb, fc.double({ min: 0, max: 30_000, noNaN: true }), fc.double({ min: 1, max: 30_000, noNaN: true }), (fanTable, pumpTable, fanRpm, pumpRpm) => {
        lengths.push(fanTable.points.length);
        const base = exampleHardware();
        const hw: HardwareContext = { ...base, fan: { ...base.fan, soundTable: fanTable }, pump: { ...base.pump, soundTable: pumpTable } };
        expect(coolerTotalDbA1m(hw, fanRpm, pumpRpm)).toBeCloseTo(coolerNoise(hw, fanRpm, pumpRpm).totalDbA1m, 9);
      }),
      { numRuns: 200 },
    );
    // fast-check's default size keeps arrays near 10 elements; size "max" must reach long tables.
    expect(Math.max(...lengths)).toBeGreaterThan(40);
  });
});

describe("sound table rules", () => {
  const withPumpTable = (points: { rpm: number; soundDbA: number }[]): unknown => {
    const hw = exampleHardware();
    return { ...hw, pump: { ...hw.pump, soundTable: { distanceM: 1, points } } };
  };

  it("speeds must rise: an error at the point, counted from 1 in the message", () => {
    const r = validateHardware(withPumpTable([{ rpm: 1200, soundDbA: 17 }, { rpm: 1200, soundDbA: 18 }, { rpm: 2800, soundDbA: 24 }]));
    expect(r.ok).toBe(false);
    const issue = r.issues.find((i) => i.code === "component.sound_table_rpm_order")!;
    expect(issue.path).toBe("/pump/soundTable/points/1/rpm");
    expect(issue.message).toMatch(/^Sound table point 2 is at 1200 RPM, not above point 1 at 1200 RPM/);
  });

  it("a table that does not cover the motor's speed range is a warning at each end", () => {
    const r = validateHardware(withPumpTable([{ rpm: 1500, soundDbA: 18 }, { rpm: 2500, soundDbA: 22 }]));
    expect(r.ok).toBe(true);
    const range = r.issues.filter((i) => i.code === "component.sound_table_range");
    expect(range.map((i) => `${i.severity} ${i.path}`)).toEqual(["warning /pump/soundTable/points/0/rpm", "warning /pump/soundTable/points/1/rpm"]);
    expect(range[1]!.message).toMatch(/above it the level is taken as 22 dB\(A\) \(held, not extrapolated\)/);
  });

  it("the schema wants at least two points and a distance from 0.1 m", () => {
    const one = validateHardware(withPumpTable([{ rpm: 1200, soundDbA: 17 }]));
    expect(one.issues.some((i) => i.path === "/pump/soundTable/points")).toBe(true);
    const hw = exampleHardware();
    const near = validateHardware({ ...hw, pump: { ...hw.pump, soundTable: { distanceM: 0.05, points: hw.pump.soundTable!.points } } });
    expect(near.issues.some((i) => i.path === "/pump/soundTable/distanceM")).toBe(true);
  });
});

describe("listener distance: refused inside the cooler's near field", () => {
  const hw = exampleHardware(); // radiator 397 mm

  it("refuses 0.3 m with a message naming the radiator size and the shortest distance accepted", () => {
    expect(listenerDistanceProblem(hw, 0.3)).toBe("0.3 m is inside the cooler's near field (closer than about the radiator's largest dimension, 397 mm), where the estimate does not hold: use at least 0.397 m.");
    expect(listenerDistanceProblem(hw, 0.4)).toBeNull();
    expect(listenerDistanceProblem(hw, 0)).toMatch(/above 0/);
  });

  it("every computation that moves levels to a distance refuses it the same way", () => {
    expect(() => evaluateCurves(quietProfile(), hw, { distanceM: 0.3 })).toThrow(EngineInputError);
    expect(() => evaluateCurves(quietProfile(), hw, { distanceM: 0.3 })).toThrow(/distanceM: 0\.3 m is inside the cooler's near field/);
    expect(() => operatingPoint(quietProfile(), hw, { heatLoadW: 100, ambientC: 25, distanceM: 0.3 })).toThrow(/near field/);
    expect(() => coolerNoise(hw, 1000, 1500, 0.3)).toThrow(/near field/);
    expect(evaluateCurves(quietProfile(), hw, { distanceM: 0.4 })).toHaveLength(51);
  });

  it("without a radiator size 480 mm is assumed, and the message says so", () => {
    const { largestDimensionMm: _d, ...radiator } = hw.radiator;
    const bare = { ...hw, radiator };
    expect(listenerDistanceProblem(bare, 0.45)).toMatch(/480 mm, assumed because the hardware gives no radiator size/);
    expect(listenerDistanceProblem(bare, 0.5)).toBeNull();
  });
});
