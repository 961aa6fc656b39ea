import { describe, expect, it } from "vitest";
import { applyHysteresisC, applyRampPct, dutyAtTemp, EngineInputError, simulateTransient } from "@/lib/engine";
import { exampleHardware, performanceProfile, quietProfile } from "./fixtures";

describe("hysteresis and ramp primitives", () => {
  it("hysteresis follows rises at once and falls only past the band", () => {
    expect(applyHysteresisC(40, 42, 2)).toBe(42);
    expect(applyHysteresisC(42, 41, 2)).toBe(42);
    expect(applyHysteresisC(42, 40, 2)).toBe(42);
    expect(applyHysteresisC(42, 39, 2)).toBe(41);
  });
  it("ramp moves at most rate × dt", () => {
    expect(applyRampPct(40, 80, 2, 5, 1)).toBe(50);
    expect(applyRampPct(40, 42, 2, 5, 1)).toBe(42);
    expect(applyRampPct(80, 40, 3, 5, 1)).toBe(77);
  });
});

describe("transient simulation", () => {
  const hw = exampleHardware();

  it("limits a step rise to the ramp-up rate", () => {
    const p = performanceProfile();
    const trace = [0, 1, 2, 3, 4, 5, 10, 30].map((tSec) => ({ tSec, tempC: tSec === 0 ? 25 : 45 }));
    const out = simulateTransient(p, hw, trace);
    const start = dutyAtTemp(p.fans.points, 25);
    const target = dutyAtTemp(p.fans.points, 45);
    expect(out[0]!.fans.dutyPct).toBeCloseTo(start, 9);
    expect(out[1]!.fans.dutyPct).toBeCloseTo(Math.min(target, start + p.fans.rampUpPctPerSec), 9);
    expect(out.at(-1)!.fans.dutyPct).toBeCloseTo(target, 9);
  });

  it("holds duty within the hysteresis band on a small drop, follows a larger one at the ramp-down rate", () => {
    const p = quietProfile();
    const trace = [
      { tSec: 0, tempC: 45 },
      { tSec: 10, tempC: 44 }, // within 2 °C band
      { tSec: 20, tempC: 40 }, // beyond it: held temperature becomes 42 °C
      { tSec: 200, tempC: 40 },
    ];
    const out = simulateTransient(p, hw, trace);
    expect(out[1]!.pump.dutyPct).toBeCloseTo(out[0]!.pump.dutyPct, 9);
    expect(out[2]!.pump.heldTempC).toBeCloseTo(42, 9);
    expect(out[2]!.pump.dutyPct).toBeCloseTo(Math.max(dutyAtTemp(p.pump.points, 42), out[1]!.pump.dutyPct - 10 * p.pump.rampDownPctPerSec), 9);
    expect(out[3]!.pump.dutyPct).toBeCloseTo(dutyAtTemp(p.pump.points, 42), 9);
  });

  it("stops fans below the stop temperature with hysteresis, and jumps to sensor-loss and critical duty", () => {
    const p = quietProfile();
    const out = simulateTransient(p, hw, [
      { tSec: 0, tempC: 28 },
      { tSec: 1, tempC: 31 },
      { tSec: 2, tempC: 29.5 }, // held 31 − 1.5 band → still running
      { tSec: 3, tempC: null },
      { tSec: 4, tempC: 61 },
    ]);
    expect(out[0]!.fans.stopped).toBe(true);
    expect(out[0]!.fans.rpm).toBe(0);
    expect(out[1]!.fans.stopped).toBe(false);
    expect(out[2]!.fans.stopped).toBe(false);
    expect(out[3]!.sensorLost).toBe(true);
    expect(out[3]!.pump.dutyPct).toBe(p.sensorLossDutyPct);
    expect(out[3]!.fans.dutyPct).toBe(p.sensorLossDutyPct);
    expect(out[4]!.fans.dutyPct).toBe(100);
    expect(out[4]!.pump.rpm).toBe(hw.pump.maxRpm);
  });

  it("the pump never stops", () => {
    const out = simulateTransient(quietProfile(), hw, Array.from({ length: 50 }, (_, i) => ({ tSec: i, tempC: 10 + i })));
    for (const s of out) expect(s.pump.rpm).toBeGreaterThanOrEqual(hw.pump.rpmAtMinDuty);
  });

  it("rejects bad traces naming the sample", () => {
    const p = quietProfile();
    expect(() => simulateTransient(p, hw, [{ tSec: 1, tempC: 30 }, { tSec: 0, tempC: 30 }])).toThrow(/trace\[1\]\.tSec/);
    expect(() => simulateTransient(p, hw, [{ tSec: 0, tempC: Number.NaN }])).toThrow(EngineInputError);
    expect(() => simulateTransient(p, hw, [{ tSec: Infinity, tempC: 30 }])).toThrow(/tSec/);
    expect(() => simulateTransient(p, hw, "x" as never)).toThrow(/trace/);
    expect(simulateTransient(p, hw, [])).toEqual([]);
  });
});
