import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  coolantRiseK,
  EngineInputError,
  fanStateAt,
  heatBalanceResidualK,
  loadSweep,
  operatingPoint,
  PROPYLENE_GLYCOL_30,
  pumpFlowLpm,
  radiatorResistanceKPerW,
  WATER_25C,
} from "@/lib/engine";
import { exampleHardware, hardwareArb, performanceProfile, quietProfile, validProfileArb } from "./fixtures";

describe("coolant heat balance Q = ṁ·c_p·ΔT", () => {
  it("200 W into 1 L/min of water at 25 °C rises 2.878 K", () => {
    // Energy balance Q = ṁ·c_p·ΔT: Incropera & DeWitt, "Fundamentals of Heat and Mass Transfer", 6th edition, §1.3.1 (from memory).
    // Water at 25 °C ρ = 997.05 kg/m³, c_p = 4.1813 kJ/kg·K (IAPWS-95, values from memory). By hand:
    // ṁ = 997.05/60 000 = 0.016618 kg/s; ṁ·c_p = 69.48 W/K; ΔT = 200/69.48 = 2.878 K.
    expect(Math.abs(coolantRiseK(200, 1, WATER_25C) - 2.878)).toBeLessThan(0.02);
  });

  it("200 W into 1 L/min of propylene glycol 30 % rises 3.03 K, more than water", () => {
    // Properties: ASHRAE Handbook — Fundamentals, 2021 edition, ch. 31 "Physical Properties of
    // Secondary Coolants (Brines)", propylene glycol tables: ρ ≈ 1028 kg/m³, c_p ≈ 3.85 kJ/kg·K
    // at 30 % by mass, 20 °C (values and chapter from memory). Worked by hand:
    // ṁ = 1028 × 1/60 000 = 0.017133 kg/s; ṁ·c_p = 0.017133 × 3850 = 65.96 W/K; ΔT = 200 / 65.96 = 3.032 K.
    expect(coolantRiseK(200, 1, PROPYLENE_GLYCOL_30)).toBeCloseTo(3.032, 3);
    expect(coolantRiseK(200, 1, PROPYLENE_GLYCOL_30)).toBeGreaterThan(coolantRiseK(200, 1, WATER_25C));
  });

  it("rise halves when flow doubles; zero flow gives Infinity", () => {
    expect(coolantRiseK(300, 2)).toBeCloseTo(coolantRiseK(300, 1) / 2, 12);
    expect(coolantRiseK(300, 0)).toBe(Infinity);
    expect(coolantRiseK(0, 0)).toBe(0);
  });

  it("pump flow is proportional to RPM (affinity law, flow ∝ N)", () => {
    expect(pumpFlowLpm(1.4, 2800, 1400)).toBeCloseTo(0.7, 12);
    expect(pumpFlowLpm(1.4, 2800, 0)).toBe(0);
  });
});

describe("radiator resistance law", () => {
  const hw = exampleHardware();
  it("passes through both anchors and the stopped value", () => {
    expect(radiatorResistanceKPerW(hw, hw.fan.rpmAtMinDuty)).toBeCloseTo(hw.radiator.thermalResistanceAtMinFanKPerW, 12);
    expect(radiatorResistanceKPerW(hw, hw.fan.maxRpm)).toBeCloseTo(hw.radiator.thermalResistanceAtMaxFanKPerW, 12);
    expect(radiatorResistanceKPerW(hw, 0)).toBe(hw.radiator.thermalResistanceFansStoppedKPerW);
    const noStopped = { ...hw, radiator: { thermalResistanceAtMinFanKPerW: 0.08, thermalResistanceAtMaxFanKPerW: 0.04 } };
    expect(radiatorResistanceKPerW(noStopped, 0)).toBeCloseTo(0.24, 12);
  });

  it("with no fixed part it is the air-side law alone: R ∝ N^-0.8, so doubling the speed gives 2^-0.8 = 0.574 of R", () => {
    // Air-side heat transfer h ∝ V^0.8 in turbulent forced convection (Dittus–Boelter form;
    // Incropera & DeWitt, "Fundamentals of Heat and Mass Transfer", 6th edition, §8.5, eq. 8.60 —
    // section and equation number from memory) and fan airflow ∝ speed (fan laws). Anchors chosen
    // so the speed-independent part is zero: 0.100 K/W at 500 RPM and 0.100 × 2^-0.8 = 0.05743 K/W at
    // 1000 RPM. By hand: at √2 × 500 = 707.1 RPM, R = 0.100 × 2^-0.4 = 0.100 × 0.7579 = 0.07579 K/W.
    const pure = { ...hw, fan: { ...hw.fan, rpmAtMinDuty: 500, maxRpm: 1000 }, radiator: { thermalResistanceAtMinFanKPerW: 0.1, thermalResistanceAtMaxFanKPerW: 0.05743 } };
    expect(radiatorResistanceKPerW(pure, 707.107)).toBeCloseTo(0.07579, 4);
    expect(radiatorResistanceKPerW(pure, 1000)).toBeCloseTo(0.05743, 5);
  });

  it("never rises as the fans speed up", () => {
    let prev = Infinity;
    for (let n = 0; n <= 2500; n += 25) {
      const r = radiatorResistanceKPerW(hw, n);
      expect(r).toBeLessThanOrEqual(prev + 1e-15);
      prev = r;
    }
  });
});

describe("operating point", () => {
  const hw = exampleHardware();

  it("satisfies T = Tamb + P·R(N(T)) within the tolerance", () => {
    const p = performanceProfile();
    const op = operatingPoint(p, hw, { heatLoadW: 250, ambientC: 25 });
    const r = radiatorResistanceKPerW(hw, fanStateAt(p, hw, op.liquidTempC).rpm);
    expect(Math.abs(op.liquidTempC - (25 + 250 * r))).toBeLessThan(0.01);
    expect(op.bracketC[1] - op.bracketC[0]).toBeLessThanOrEqual(0.001);
    expect(op.holdsBelowCritical).toBe(true);
    expect(op.coolantRiseK).toBeCloseTo(coolantRiseK(250, op.pumpFlowLpm), 12);
  });

  it("zero load settles at ambient", () => {
    const op = operatingPoint(quietProfile(), hw, { heatLoadW: 0, ambientC: 22 });
    expect(op.liquidTempC).toBeCloseTo(22, 12);
  });

  it("flags a load the curve cannot hold below the critical temperature", () => {
    const op = operatingPoint(quietProfile(), hw, { heatLoadW: 1200, ambientC: 35 });
    expect(op.holdsBelowCritical).toBe(false);
    expect(op.liquidTempC).toBeGreaterThanOrEqual(60);
  });

  it("finds the fan-stop step: fans stopped below, cooling enough above", () => {
    // Quiet profile stops fans below 30 °C; with 0.25 K/W stopped and 0.075 K/W at min, 40 W at 25 °C
    // would reach 35 °C with fans stopped but only 28 °C with them running: the liquid sits at 30 °C.
    const op = operatingPoint(quietProfile(), hw, { heatLoadW: 40, ambientC: 25 });
    expect(op.liquidTempC).toBeCloseTo(30, 2);
    expect(op.onFanStopStep).toBe(true);
  });

  it("sweep gives 31 loads from 50 to 350 W with liquid temperature rising", () => {
    const sweep = loadSweep(performanceProfile(), hw, { ambientC: 25 });
    expect(sweep).toHaveLength(31);
    expect(sweep[0]!.heatLoadW).toBe(50);
    expect(sweep[30]!.heatLoadW).toBe(350);
    for (let i = 1; i < sweep.length; i++) expect(sweep[i]!.liquidTempC).toBeGreaterThanOrEqual(sweep[i - 1]!.liquidTempC);
    // The sweep's warm start finds the same roots as solving each load alone.
    for (const point of sweep) {
      const alone = operatingPoint(performanceProfile(), hw, { heatLoadW: point.heatLoadW, ambientC: 25 });
      expect(Math.abs(point.liquidTempC - alone.liquidTempC)).toBeLessThanOrEqual(0.001);
    }
  });

  it("rejects bad input naming the parameter", () => {
    const p = quietProfile();
    expect(() => operatingPoint(p, hw, { heatLoadW: Number.NaN, ambientC: 25 })).toThrow(EngineInputError);
    expect(() => operatingPoint(p, hw, { heatLoadW: -5, ambientC: 25 })).toThrow(/heatLoadW/);
    expect(() => operatingPoint(p, hw, { heatLoadW: 100, ambientC: Infinity })).toThrow(/ambientC/);
    expect(() => operatingPoint(p, hw, { heatLoadW: 100, ambientC: 25, distanceM: 0 })).toThrow(/distanceM/);
    expect(() => loadSweep(p, hw, { ambientC: 25, fromW: 300, toW: 100 })).toThrow(/toW/);
  });

  it("property: residual within tolerance, root bracketed and unique (residual monotonic)", () => {
    fc.assert(
      fc.property(validProfileArb, hardwareArb, fc.integer({ min: 0, max: 400 }), fc.integer({ min: 10, max: 40 }), (profile, hw2, load, amb) => {
        const op = operatingPoint(profile, hw2, { heatLoadW: load, ambientC: amb });
        const [lo, hi] = op.bracketC;
        expect(hi - lo).toBeLessThanOrEqual(0.001 + 1e-12);
        const gLo = heatBalanceResidualK(profile, hw2, load, amb, lo);
        const gHi = heatBalanceResidualK(profile, hw2, load, amb, hi);
        expect(gLo).toBeLessThanOrEqual(1e-9);
        expect(gHi).toBeGreaterThanOrEqual(-1e-9);
        // The temperature is within the tolerance of the root; the residual is bounded by g's rise over the bracket.
        expect(Math.abs(op.residualK)).toBeLessThanOrEqual(gHi - gLo + 1e-9);
        // Away from the fan-stop step g rises by at most 1 + P·|dR/dT| per K; 0.001 K keeps it small for real curves.
        if (!op.onFanStopStep && (gHi - gLo) / Math.max(hi - lo, 1e-12) < 20) expect(Math.abs(op.residualK)).toBeLessThan(0.02);
        // Uniqueness: g(T) never falls, so it crosses zero once.
        let prev = -Infinity;
        for (let t = amb; t <= amb + 120; t += 0.25) {
          const g = heatBalanceResidualK(profile, hw2, load, amb, t);
          expect(g).toBeGreaterThanOrEqual(prev - 1e-9);
          prev = g;
        }
      }),
      { numRuns: 60 },
    );
  });
});
