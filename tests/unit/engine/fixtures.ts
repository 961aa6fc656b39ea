import { readFileSync } from "node:fs";
import path from "node:path";
import fc from "fast-check";
import type { CoolingProfile, CurvePoint, HardwareContext } from "@/lib/engine";

const root = path.resolve(__dirname, "../../..");
export const examplePath = (name: string): string => path.join(root, "examples", name);
export const readExample = (name: string): string => readFileSync(examplePath(name), "utf8");

export const quietProfile = (): CoolingProfile => JSON.parse(readExample("quiet.profile.json")) as CoolingProfile;
export const performanceProfile = (): CoolingProfile => JSON.parse(readExample("performance.profile.json")) as CoolingProfile;
export const exampleHardware = (): HardwareContext => JSON.parse(readExample("cooler-360.hardware.json")) as HardwareContext;

/** Strictly increasing temperatures and non-decreasing duties ending at 100 % by `lastTempC`. */
const curvePoints = (minDutyPct: number): fc.Arbitrary<CurvePoint[]> =>
  fc
    .record({
      startTempC: fc.integer({ min: 40, max: 90 }).map((c) => c / 2),
      steps: fc.array(fc.record({ dTempCode: fc.integer({ min: 1, max: 12 }), dDutyCode: fc.integer({ min: 0, max: 30 }) }), { minLength: 1, maxLength: 7 }),
      startDuty: fc.integer({ min: minDutyPct * 2, max: 160 }).map((c) => c / 2),
    })
    .map(({ startTempC, steps, startDuty }) => {
      const points: CurvePoint[] = [{ tempC: startTempC, dutyPct: startDuty }];
      let t = startTempC;
      let d = startDuty;
      for (const s of steps) {
        t += s.dTempCode / 2;
        d = Math.min(100, d + s.dDutyCode / 2);
        points.push({ tempC: t, dutyPct: d });
      }
      points[points.length - 1]!.dutyPct = 100;
      return points;
    });

/** Valid profiles on the stored 0.5 grid (pump duty ≥ 40 %, above the example pump's 30 % minimum; 0 % fan points only below the fan stop, as the example fan stops at 0 % duty). */
export const validProfileArb: fc.Arbitrary<CoolingProfile> = fc
  .record({
    pump: curvePoints(40),
    fans: curvePoints(0),
    hyst: fc.integer({ min: 0, max: 50 }).map((c) => c / 10),
    up: fc.integer({ min: 1, max: 200 }).map((c) => c / 2),
    down: fc.integer({ min: 1, max: 200 }).map((c) => c / 2),
    fanStop: fc.option(fc.integer({ min: 20, max: 60 }).map((c) => c / 2), { nil: undefined }),
  })
  .map(({ pump, fans, hyst, up, down, fanStop }) => {
    const lastT = Math.max(pump[pump.length - 1]!.tempC, fans[fans.length - 1]!.tempC);
    const profile: CoolingProfile = {
      formatVersion: 1,
      name: "Generated",
      criticalTempC: Math.min(100, Math.max(30, lastT + 2)),
      sensorLossDutyPct: 100,
      pump: { points: pump, hysteresisC: hyst, rampUpPctPerSec: up, rampDownPctPerSec: down },
      fans: { points: fans, hysteresisC: hyst, rampUpPctPerSec: up, rampDownPctPerSec: down },
    };
    if (fanStop !== undefined && fanStop < profile.criticalTempC) profile.fans.stopBelowTempC = fanStop;
    // The example fan stops at 0 % duty: a 0 % point is valid only below the fan stop temperature.
    const stopC = profile.fans.stopBelowTempC;
    for (const p of profile.fans.points) if (p.dutyPct === 0 && (stopC === undefined || p.tempC >= stopC)) p.dutyPct = 0.5;
    return profile;
  });

/** Any in-range values, not necessarily on the stored grid or obeying the rules. */
const anyCurve = fc.record({
  points: fc.array(fc.record({ tempC: fc.double({ min: 0, max: 100, noNaN: true }), dutyPct: fc.double({ min: 0, max: 100, noNaN: true }) }), { minLength: 1, maxLength: 32 }),
  hysteresisC: fc.double({ min: 0, max: 10, noNaN: true }),
  rampUpPctPerSec: fc.double({ min: 0.5, max: 100, noNaN: true }),
  rampDownPctPerSec: fc.double({ min: 0.5, max: 100, noNaN: true }),
});
export const anyInRangeProfileArb: fc.Arbitrary<CoolingProfile> = fc
  .record({
    critical: fc.double({ min: 30, max: 100, noNaN: true }),
    sensorLoss: fc.double({ min: 0, max: 100, noNaN: true }),
    pump: anyCurve,
    fans: anyCurve,
    stop: fc.option(fc.double({ min: 0, max: 100, noNaN: true }), { nil: undefined }),
  })
  .map(({ critical, sensorLoss, pump, fans, stop }) => ({
    formatVersion: 1 as const,
    name: "Any",
    criticalTempC: critical,
    sensorLossDutyPct: sensorLoss,
    pump,
    fans: stop === undefined ? fans : { ...fans, stopBelowTempC: stop },
  }));

/** Hardware contexts with sensible orderings, for property tests. */
export const hardwareArb: fc.Arbitrary<HardwareContext> = fc
  .record({
    fanMinDuty: fc.integer({ min: 0, max: 60 }),
    fanMinRpm: fc.integer({ min: 200, max: 1000 }),
    fanSpan: fc.integer({ min: 0, max: 3000 }),
    pumpMinRpm: fc.integer({ min: 600, max: 2000 }),
    pumpSpan: fc.integer({ min: 0, max: 3000 }),
    rFast: fc.integer({ min: 10, max: 100 }).map((x) => x / 1000),
    rExtra: fc.integer({ min: 0, max: 100 }).map((x) => x / 1000),
    fanCount: fc.integer({ min: 1, max: 12 }),
    exponent: fc.integer({ min: 40, max: 60 }),
  })
  .map((h) => {
    const base = exampleHardware();
    return {
      ...base,
      fanCount: h.fanCount,
      fan: { ...base.fan, minDutyPct: h.fanMinDuty, rpmAtMinDuty: h.fanMinRpm, maxRpm: h.fanMinRpm + h.fanSpan, soundExponent: h.exponent },
      pump: { ...base.pump, rpmAtMinDuty: h.pumpMinRpm, maxRpm: h.pumpMinRpm + h.pumpSpan },
      radiator: { thermalResistanceAtMaxFanKPerW: h.rFast, thermalResistanceAtMinFanKPerW: h.rFast + h.rExtra },
    };
  });

