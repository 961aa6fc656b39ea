import { describe, expect, it } from "vitest";
import { applyHysteresisC, applyRampPct, EngineInputError, simulateTransient } from "@/lib/engine";
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
    // Worked by hand from examples/performance.profile.json: fans 20 °C → 35 %, 35 °C → 55 %
    // (4/3 % per °C), 45 °C → 80 %; ramp up 20 %/s. At 25 °C: 35 + 5·4/3 = 41.67 %. A step to
    // 45 °C (target 80 %) rises 20 % per second: 61.67 % after 1 s, 80 % from 2 s on.
    const p = performanceProfile();
    const trace = [0, 1, 2, 3, 4, 5, 10, 30].map((tSec) => ({ tSec, tempC: tSec === 0 ? 25 : 45 }));
    const out = simulateTransient(p, hw, trace);
    expect(out[0]!.fans.dutyPct).toBeCloseTo(41.667, 3);
    expect(out[1]!.fans.dutyPct).toBeCloseTo(61.667, 3);
    expect(out[2]!.fans.dutyPct).toBe(80);
    expect(out.at(-1)!.fans.dutyPct).toBe(80);
  });

  it("holds duty within the hysteresis band on a small drop, follows a larger one at the ramp-down rate", () => {
    const p = quietProfile();
    const trace = [
      { tSec: 0, tempC: 45 },
      { tSec: 10, tempC: 44 }, // within 2 °C band
      { tSec: 20, tempC: 40 }, // beyond it: held temperature becomes 42 °C
      { tSec: 200, tempC: 40 },
    ];
    // Worked by hand from examples/quiet.profile.json: pump 35 °C → 50 %, 45 °C → 70 % (2 % per °C),
    // band 2 °C, ramp down 2 %/s. At 45 °C 70 %; at 44 °C held 45 → 70 %; at 40 °C held 42 → target
    // 64 %, ramp over 10 s allows 20 %, so 64 %; it stays there.
    const out = simulateTransient(p, hw, trace);
    expect(out[0]!.pump.dutyPct).toBe(70);
    expect(out[1]!.pump.dutyPct).toBe(70);
    expect(out[2]!.pump.heldTempC).toBe(42);
    expect(out[2]!.pump.dutyPct).toBeCloseTo(64, 9);
    expect(out[3]!.pump.dutyPct).toBeCloseTo(64, 9);
  });

  it("stops fans below the stop temperature with hysteresis, and jumps to sensor-loss and critical duty", () => {
    const p = quietProfile();
    const out = simulateTransient(p, hw, [
      { tSec: 0, tempC: 28 },
      { tSec: 1, tempC: 31 },
      { tSec: 2, tempC: 29.5 }, // held 31 − 1.5 band → still running
      { tSec: 3, tempC: null }, // one missing reading: bridged
      { tSec: 4, tempC: null }, // the second: sensor lost
      { tSec: 5, tempC: 61 },
    ]);
    expect(out[0]!.fans.stopped).toBe(true);
    expect(out[0]!.fans.rpm).toBe(0);
    expect(out[1]!.fans.stopped).toBe(false);
    expect(out[2]!.fans.stopped).toBe(false);
    expect(out[3]!.sensorLost).toBe(false);
    expect(out[3]!.glitchHeld).toBe(true);
    expect(out[4]!.sensorLost).toBe(true);
    expect(out[4]!.pump.dutyPct).toBe(p.sensorLossDutyPct);
    expect(out[4]!.fans.dutyPct).toBe(p.sensorLossDutyPct);
    expect(out[5]!.fans.dutyPct).toBe(100);
    expect(out[5]!.pump.rpm).toBe(hw.pump.maxRpm);
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

/*
 * Traces worked by hand from the example "Hush" profile (examples/quiet.profile.json):
 * fans 30 °C → 25 %, 40 °C → 40 %, 50 °C → 70 % (3 %/°C between 40 and 50 °C), band
 * 1.5 °C, ramp down 2 %/s, stop below 30 °C; pump 35 °C → 50 %, 45 °C → 70 % (2 %/°C),
 * band 2 °C, ramp down 2 %/s. Hysteresis is the play operator held = max(T, min(held,
 * T + band)) (M. A. Krasnosel'skii, A. V. Pokrovskii, "Systems with Hysteresis",
 * Springer 1989, ch. on the play operator — from memory).
 */
describe("transient traces worked by hand", () => {
  const hw = exampleHardware();

  it("one missing reading keeps the output and the hysteresis state: no jump to the sensor-loss duty, no reset", () => {
    const out = simulateTransient(quietProfile(), hw, [
      { tSec: 0, tempC: 45 }, // fans 40 + 3·5 = 55 %, pump 70 %
      { tSec: 1, tempC: 42 }, // fans held 43.5 → 50.5 %, ramp 55 − 2 = 53 %; pump held 44 → 68 %
      { tSec: 2, tempC: null },
      { tSec: 3, tempC: 42 }, // fans held still 43.5 → 50.5 %, ramp 53 − 2 = 51 %
    ]);
    expect(out.map((s) => s.fans.dutyPct)).toEqual([55, 53, 53, 51]);
    expect(out.map((s) => s.pump.dutyPct)).toEqual([70, 68, 68, 68]);
    expect(out.map((s) => s.fans.heldTempC)).toEqual([45, 43.5, 43.5, 43.5]);
    expect(out.map((s) => s.sensorLost)).toEqual([false, false, false, false]);
    expect(out[2]!.glitchHeld).toBe(true);
    // The fans never stopped or jumped to 100 % on the way.
    expect(out.every((s) => !s.fans.stopped && s.fans.dutyPct < 100)).toBe(true);
  });

  it("a longer loss runs the sensor-loss duty, then ramps down from it with the hysteresis state kept", () => {
    const out = simulateTransient(quietProfile(), hw, [
      { tSec: 0, tempC: 45 },
      { tSec: 1, tempC: null }, // bridged
      { tSec: 2, tempC: null }, // lost: 100 % at once
      { tSec: 3, tempC: 44 }, // held max(44, min(45, 45.5)) = 45 (kept, not reset to 44): target 55 %, ramp 100 − 2 = 98 %
    ]);
    expect(out.map((s) => s.sensorLost)).toEqual([false, false, true, false]);
    expect(out.map((s) => s.fans.dutyPct)).toEqual([55, 55, 100, 98]);
    expect(out[3]!.fans.heldTempC).toBe(45);
    expect(out[3]!.pump.heldTempC).toBe(45);
  });

  it("a trace that starts without a reading runs the sensor-loss duty", () => {
    const out = simulateTransient(quietProfile(), hw, [{ tSec: 0, tempC: null }]);
    expect(out[0]!.sensorLost).toBe(true);
    expect(out[0]!.fans.dutyPct).toBe(100);
  });

  it("the fan stop is an immediate cut at the held stop temperature; the fans restart at the curve's duty", () => {
    const out = simulateTransient(quietProfile(), hw, [
      { tSec: 0, tempC: 31 }, // 25 + 1.5·1 = 26.5 %
      { tSec: 1, tempC: 28 }, // held max(28, min(31, 29.5)) = 29.5 < 30 → stopped at once (the ramp would still give 24.5 %+)
      { tSec: 2, tempC: 29 }, // held 29.5: still stopped
      { tSec: 3, tempC: 30 }, // held 30: running at the curve's 25 % (ramped 26.5 → 25 while stopped)
    ]);
    expect(out.map((s) => s.fans.stopped)).toEqual([false, true, true, false]);
    expect(out.map((s) => s.fans.dutyPct)).toEqual([26.5, 0, 0, 25]);
    // Example fan: 20 % → 500 RPM, 100 % → 2,000 RPM, linear: 500 + 1,500·5/80 = 593.75 RPM at 25 %.
    expect(out[3]!.fans.rpm).toBeCloseTo(593.75, 9);
    expect(out[1]!.fans.rpm).toBe(0);
  });

  it("hysteresis keeps a fan stop from chattering; with no band the fans cycle on every wobble", () => {
    const wobble = Array.from({ length: 10 }, (_, i) => ({ tSec: i, tempC: i % 2 === 0 ? 30.2 : 29.8 }));
    const banded = simulateTransient(quietProfile(), hw, wobble);
    expect(banded.filter((s) => s.fans.stopped)).toHaveLength(0);
    const bare = quietProfile();
    bare.fans.hysteresisC = 0;
    const cycling = simulateTransient(bare, hw, wobble);
    expect(cycling.filter((s) => s.fans.stopped)).toHaveLength(5);
  });
});
