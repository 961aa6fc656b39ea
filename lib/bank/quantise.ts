import type { CoolingProfile, CurveSettings, ProfileSettings } from "../profile/types";
import * as layout from "./layout";

// Read once: where this file runs as CommonJS (tsx, bundlers in development) every use of an
// imported name is a getter call, and these functions run for every point validated.
const { DUTY_STEP_PCT, HYSTERESIS_STEP_C, MAX_DUTY_CODE, MAX_HYSTERESIS_CODE, MAX_RAMP_CODE, MAX_TEMP_CODE, RAMP_STEP_PCT_PER_SEC, TEMP_STEP_C } = layout;

// Guards against 0.3 / 0.1 = 2.9999999999999996 style floating-point error.
const EPS = 1e-9;
const clamp = (v: number, lo: number, hi: number): number => Math.min(hi, Math.max(lo, v));

/*
 * Every value is rounded in the direction that gives more cooling, so the
 * as-flashed curve is never less safe than the authored one: duties and
 * ramp-up limits up; point, critical and fan-stop temperatures down (the duty
 * rises, full speed and the fan start come at a lower temperature); ramp-down
 * limits down (the duty falls more slowly); hysteresis up, because the held
 * temperature follows a falling liquid temperature only once it is more than
 * the hysteresis below, so a wider band keeps the higher duty (and the fans
 * turning) longer. docs/engine.md gives the whole rule.
 */
export const tempCode = (tempC: number): number => clamp(Math.floor(tempC / TEMP_STEP_C + EPS), 0, MAX_TEMP_CODE);
export const dutyCode = (dutyPct: number): number => clamp(Math.ceil(dutyPct / DUTY_STEP_PCT - EPS), 0, MAX_DUTY_CODE);
export const hysteresisCode = (hysteresisC: number): number => clamp(Math.ceil(hysteresisC / HYSTERESIS_STEP_C - EPS), 0, MAX_HYSTERESIS_CODE);
export const rampUpCode = (pctPerSec: number): number => clamp(Math.ceil(pctPerSec / RAMP_STEP_PCT_PER_SEC - EPS), 1, MAX_RAMP_CODE);
export const rampDownCode = (pctPerSec: number): number => clamp(Math.floor(pctPerSec / RAMP_STEP_PCT_PER_SEC + EPS), 1, MAX_RAMP_CODE);

export const tempFromCode = (code: number): number => code * TEMP_STEP_C;
export const dutyFromCode = (code: number): number => code * DUTY_STEP_PCT;
// Rounded to one decimal so 3 × 0.1 reads back as 0.3, not 0.30000000000000004.
export const hysteresisFromCode = (code: number): number => Math.round(code) / 10;
export const rampFromCode = (code: number): number => code * RAMP_STEP_PCT_PER_SEC;

/** A point, critical or fan-stop temperature as stored: 0.5 °C steps, rounded down. */
export const storedTempC = (tempC: number): number => tempFromCode(tempCode(tempC));
/** A point or sensor-loss duty as stored: 0.5 % steps, rounded up. */
export const storedDutyPct = (dutyPct: number): number => dutyFromCode(dutyCode(dutyPct));
/** A hysteresis as stored: 0.1 °C steps, rounded up. */
export const storedHysteresisC = (hysteresisC: number): number => hysteresisFromCode(hysteresisCode(hysteresisC));
/** A ramp-up limit as stored: 0.5 %/s steps, rounded up. */
export const storedRampUpPctPerSec = (pctPerSec: number): number => rampFromCode(rampUpCode(pctPerSec));
/** A ramp-down limit as stored: 0.5 %/s steps, rounded down. */
export const storedRampDownPctPerSec = (pctPerSec: number): number => rampFromCode(rampDownCode(pctPerSec));

/** One curve as stored: points, hysteresis and ramp limits on their steps, rounded toward more cooling. */
export function quantiseCurve<C extends CurveSettings>(curve: C): C {
  return {
    ...curve,
    points: curve.points.map((p) => ({ tempC: storedTempC(p.tempC), dutyPct: storedDutyPct(p.dutyPct) })),
    hysteresisC: storedHysteresisC(curve.hysteresisC),
    rampUpPctPerSec: storedRampUpPctPerSec(curve.rampUpPctPerSec),
    rampDownPctPerSec: storedRampDownPctPerSec(curve.rampDownPctPerSec),
  };
}

/**
 * The profile as the board will run it after encoding: temperatures in 0.5 °C
 * steps (rounded down), duties in 0.5 % steps (rounded up), hysteresis in
 * 0.1 °C steps (up: a wider band holds the higher duty longer), ramp limits in 0.5 %/s steps (up for rising, down for
 * falling). Names and text are kept. For the editor's as-flashed preview.
 */
export function quantise<P extends ProfileSettings | CoolingProfile>(profile: P): P {
  const fans = quantiseCurve(profile.fans);
  if (profile.fans.stopBelowTempC !== undefined) fans.stopBelowTempC = storedTempC(profile.fans.stopBelowTempC);
  return {
    ...profile,
    criticalTempC: storedTempC(profile.criticalTempC),
    sensorLossDutyPct: storedDutyPct(profile.sensorLossDutyPct),
    pump: quantiseCurve(profile.pump),
    fans,
  };
}
