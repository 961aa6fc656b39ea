import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { addLevelsDb, coolerNoise, coolerTotalDbA1m, identicalSourcesDb, levelAtDistanceDb, levelAtSpeedDb } from "@/lib/engine";
import { exampleHardware, hardwareArb } from "./fixtures";

describe("sound level arithmetic", () => {
  it("fan-law sound scaling: doubling speed adds 15.05 dB, halving removes it", () => {
    // Fan law for sound power, +50·log10(N2/N1): ASHRAE Handbook — HVAC Systems and Equipment,
    // 2020 edition, ch. 21 "Fans", fan-law table (from memory, not checked against the text).
    // 50·log10(2) = 50 × 0.30103 = 15.05 dB (worked by hand).
    expect(levelAtSpeedDb(30, 1000, 2000)).toBeCloseTo(45.05, 2);
    expect(levelAtSpeedDb(30, 1000, 500)).toBeCloseTo(14.95, 2);
    expect(levelAtSpeedDb(30, 1000, 1000)).toBe(30);
    // Exponent kept a parameter (some small axial fans follow 55–60; an observation, not a cited figure):
    // 60 × 0.30103 = 18.06 dB per doubling.
    expect(levelAtSpeedDb(30, 1000, 2000, 60)).toBeCloseTo(48.06, 2);
  });

  it("incoherent addition: 40 + 40 = 43.01 dB, 40 + 30 = 40.41 dB, 40 + 40 + 40 + 40 = 46.02 dB", () => {
    // Logarithmic sum of levels, common practice in acoustics (e.g. ASHRAE Handbook — Fundamentals,
    // 2021 edition, ch. 8 "Sound and Vibration", combining levels — chapter number from memory).
    // By hand: 10·log10(2) = 3.01; 10·log10(1 + 10^−1) = 10·log10(1.1) = 0.414; 10·log10(4) = 6.02.
    expect(addLevelsDb([40, 40])).toBeCloseTo(43.01, 2);
    expect(addLevelsDb([40, 30])).toBeCloseTo(40.41, 2);
    expect(addLevelsDb([40, 40, 40, 40])).toBeCloseTo(46.02, 2);
  });

  it("n equal sources: +3.01 dB for 2, +4.77 dB for 3, +10 dB for 10 (energy sum, common practice)", () => {
    // By hand: 10·log10(2) = 3.010, 10·log10(3) = 4.771, 10·log10(10) = 10.
    expect(identicalSourcesDb(35, 1)).toBe(35);
    expect(identicalSourcesDb(35, 2)).toBeCloseTo(38.01, 2);
    expect(identicalSourcesDb(35, 3)).toBeCloseTo(39.77, 2);
    expect(identicalSourcesDb(35, 10)).toBeCloseTo(45, 9);
  });

  it("inverse square: −6.02 dB per doubling of distance, 1 m → 10 m is −20 dB", () => {
    // Free-field point source, common practice in acoustics: 20·log10(2) = 6.02 dB, 20·log10(10) = 20 dB (by hand).
    expect(levelAtDistanceDb(50, 2)).toBeCloseTo(43.98, 2);
    expect(levelAtDistanceDb(50, 4)).toBeCloseTo(37.96, 2);
    expect(levelAtDistanceDb(50, 10)).toBeCloseTo(30, 9);
  });

  it("a stopped source contributes nothing", () => {
    expect(levelAtSpeedDb(30, 1000, 0)).toBe(-Infinity);
    expect(addLevelsDb([-Infinity, 37])).toBeCloseTo(37, 12);
    expect(addLevelsDb([])).toBe(-Infinity);
    const hw = exampleHardware();
    const stopped = coolerNoise(hw, 0, 2000);
    expect(stopped.fansDbA).toBe(-Infinity);
    expect(stopped.totalDbA1m).toBeCloseTo(stopped.pumpDbA, 12);
  });

  it("cooler noise: three fans at their reference speed and an equal pump make four equal sources", () => {
    // Worked by hand: each example fan is 28 dB(A) at 1 m at its reference 1500 RPM; three fans
    // 28 + 4.77 = 32.77. A pump whose table gives 28 dB(A) at 2000 RPM makes four equal sources:
    // 28 + 10·log10(4) = 34.02 dB(A) at 1 m; at 2 m −6.02 → 28.00 (energy sum and inverse square, common practice).
    const base = exampleHardware();
    const hw = { ...base, pump: { ...base.pump, soundTable: { distanceM: 1, points: [{ rpm: 1200, soundDbA: 22 }, { rpm: 2000, soundDbA: 28 }, { rpm: 2800, soundDbA: 31 }] } } };
    const n = coolerNoise(hw, 1500, 2000, 2);
    expect(n.fansDbA).toBeCloseTo(32.77, 2);
    expect(n.pumpDbA).toBe(28);
    expect(n.totalDbA1m).toBeCloseTo(34.02, 2);
    expect(n.totalDbAAtDistance).toBeCloseTo(28.0, 2);
  });

  it("bad distances give NaN rather than a number", () => {
    expect(levelAtDistanceDb(40, 0)).toBeNaN();
    expect(levelAtDistanceDb(40, -1)).toBeNaN();
    expect(identicalSourcesDb(40, 0)).toBe(-Infinity);
  });

  it("property: noise never falls as speed rises", () => {
    fc.assert(
      fc.property(hardwareArb, fc.double({ min: 0, max: 5000, noNaN: true }), fc.double({ min: 0, max: 5000, noNaN: true }), fc.double({ min: 1, max: 5000, noNaN: true }), (hw, a, b, pumpRpm) => {
        const [lo, hi] = a <= b ? [a, b] : [b, a];
        expect(coolerNoise(hw, hi, pumpRpm).totalDbA1m).toBeGreaterThanOrEqual(coolerNoise(hw, lo, pumpRpm).totalDbA1m - 1e-9);
        expect(coolerNoise(hw, pumpRpm, hi).totalDbA1m).toBeGreaterThanOrEqual(coolerNoise(hw, pumpRpm, lo).totalDbA1m - 1e-9);
      }),
    );
  });

  it("property: the power-domain total equals the dB-domain sum", () => {
    fc.assert(
      fc.property(hardwareArb, fc.double({ min: 0, max: 5000, noNaN: true }), fc.double({ min: 1, max: 5000, noNaN: true }), (hw, fanRpm, pumpRpm) => {
        expect(coolerTotalDbA1m(hw, fanRpm, pumpRpm)).toBeCloseTo(coolerNoise(hw, fanRpm, pumpRpm).totalDbA1m, 9);
      }),
    );
  });
});
