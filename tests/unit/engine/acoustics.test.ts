import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { addLevelsDb, coolerNoise, coolerTotalDbA1m, identicalSourcesDb, levelAtDistanceDb, levelAtSpeedDb } from "@/lib/engine";
import { exampleHardware, hardwareArb } from "./fixtures";

describe("sound level arithmetic", () => {
  it("fan-law sound scaling: doubling speed adds 50·log10(2) = 15.05 dB", () => {
    // From memory: ASHRAE Handbook — HVAC Systems and Equipment, ch. "Fans", fan-law table; AMCA Publication 301.
    expect(levelAtSpeedDb(30, 1000, 2000) - 30).toBeCloseTo(15.05, 2);
    expect(levelAtSpeedDb(30, 1000, 1000)).toBeCloseTo(30, 12);
    // Exponent kept a parameter: some texts use 55–60 for small axial fans.
    expect(levelAtSpeedDb(30, 1000, 2000, 60) - 30).toBeCloseTo(60 * Math.log10(2), 9);
  });

  it("incoherent addition: 40 + 40 = 43.01 dB, 40 + 30 = 40.41 dB", () => {
    // From memory: ASHRAE Handbook — Fundamentals, ch. "Sound and Vibration"; Bies & Hansen, "Engineering Noise Control".
    expect(addLevelsDb([40, 40])).toBeCloseTo(43.01, 2);
    expect(addLevelsDb([40, 30])).toBeCloseTo(40.41, 2);
  });

  it("n equal sources add 10·log10(n) and agree with the sum", () => {
    // From memory: ASHRAE Handbook — Fundamentals, ch. "Sound and Vibration".
    for (const n of [1, 2, 3, 4, 7]) {
      expect(identicalSourcesDb(35, n)).toBeCloseTo(addLevelsDb(Array.from({ length: n }, () => 35)), 9);
    }
  });

  it("inverse square: −6.02 dB per doubling of distance, 1 m → 10 m is −20 dB", () => {
    // From memory: ASHRAE Handbook — Fundamentals, ch. "Sound and Vibration"; Bies & Hansen, "Engineering Noise Control".
    expect(levelAtDistanceDb(50, 2) - 50).toBeCloseTo(-6.02, 2);
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

  it("cooler noise combines n fans and the pump (computed from the rules)", () => {
    const hw = exampleHardware();
    const fan = hw.fan.soundRefDbA + 50 * Math.log10(1800 / hw.fan.soundRefRpm) + 10 * Math.log10(hw.fanCount);
    const pump = hw.pump.soundRefDbA + 50 * Math.log10(2000 / hw.pump.soundRefRpm);
    const total = 10 * Math.log10(10 ** (fan / 10) + 10 ** (pump / 10));
    const n = coolerNoise(hw, 1800, 2000, 3);
    expect(n.totalDbA1m).toBeCloseTo(total, 9);
    expect(n.totalDbAAtDistance).toBeCloseTo(total - 20 * Math.log10(3), 9);
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
