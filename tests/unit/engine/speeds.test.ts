import { describe, expect, it } from "vitest";
import { dutyAtTemp, dutyToRpm, evaluateCurves, EngineInputError, fanStateAt, pumpStateAt } from "@/lib/engine";
import { exampleHardware, quietProfile } from "./fixtures";

describe("curve interpolation", () => {
  const points = [
    { tempC: 30, dutyPct: 20 },
    { tempC: 40, dutyPct: 60 },
    { tempC: 50, dutyPct: 100 },
  ];
  it("is linear between points and held outside them", () => {
    expect(dutyAtTemp(points, 35)).toBeCloseTo(40, 12);
    expect(dutyAtTemp(points, 47.5)).toBeCloseTo(90, 12);
    expect(dutyAtTemp(points, 40)).toBe(60);
    expect(dutyAtTemp(points, 10)).toBe(20);
    expect(dutyAtTemp(points, 90)).toBe(100);
  });
  it("gives NaN for no points or a non-finite temperature", () => {
    expect(dutyAtTemp([], 40)).toBeNaN();
    expect(dutyAtTemp(points, Number.NaN)).toBeNaN();
  });
});

describe("duty → RPM", () => {
  const hw = exampleHardware();
  it("is linear from (min duty, RPM at min) to (100 %, max RPM)", () => {
    // Intel 4-Wire PWM fan spec rev 1.3: 100 % duty is full speed (its PWM control input; from memory, section not checked);
    // below minimum duty the fan keeps its minimum speed, or — for a fan that stops at 0 % duty — stops at 0 % (§3.4).
    // Example fan: 20 % → 500 RPM, 100 % → 2000 RPM. By hand: 60 % is halfway → 1250 RPM; 90 % → 500 + 1500 × 70/80 = 1812.5 RPM.
    expect(dutyToRpm(100, hw.fan)).toBe(2000);
    expect(dutyToRpm(20, hw.fan)).toBe(500);
    expect(dutyToRpm(60, hw.fan)).toBeCloseTo(1250, 9);
    expect(dutyToRpm(90, hw.fan)).toBeCloseTo(1812.5, 9);
    expect(dutyToRpm(10, hw.fan)).toBe(500);
    expect(dutyToRpm(0, hw.fan)).toBe(0); // the example fan stops at 0 % duty
    expect(dutyToRpm(0, { ...hw.fan, stopsAtZeroDuty: false })).toBe(500);
    expect(dutyToRpm(150, hw.fan)).toBe(2000);
    expect(dutyToRpm(Number.NaN, hw.fan)).toBeNaN();
  });

  it("fans stop only below the stop temperature; the pump never stops", () => {
    const p = quietProfile();
    expect(fanStateAt(p, hw, 25)).toEqual({ dutyPct: 0, rpm: 0, stopped: true });
    expect(fanStateAt(p, hw, 30).rpm).toBeGreaterThan(0);
    for (let t = 0; t <= 100; t += 5) expect(pumpStateAt(p, hw, t).rpm).toBeGreaterThanOrEqual(hw.pump.rpmAtMinDuty);
  });

  it("runs both at 100 % at and above the critical temperature", () => {
    const p = quietProfile();
    expect(pumpStateAt(p, hw, p.criticalTempC).dutyPct).toBe(100);
    expect(fanStateAt(p, hw, p.criticalTempC + 5).rpm).toBe(hw.fan.maxRpm);
  });
});

describe("curve table", () => {
  const hw = exampleHardware();
  it("has one row per °C from 20 to 70 by default", () => {
    const rows = evaluateCurves(quietProfile(), hw);
    expect(rows).toHaveLength(51);
    expect(rows[0]!.tempC).toBe(20);
    expect(rows[50]!.tempC).toBe(70);
    expect(rows[0]!.fansStopped).toBe(true);
    expect(rows[50]!.pumpRpm).toBe(hw.pump.maxRpm);
  });
  it("rejects bad ranges", () => {
    expect(() => evaluateCurves(quietProfile(), hw, { stepC: 0 })).toThrow(EngineInputError);
    expect(() => evaluateCurves(quietProfile(), hw, { fromC: 50, toC: 20 })).toThrow(/toC/);
  });
});
