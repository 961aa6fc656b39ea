import type { HardwareContext } from "../hardware/types";
import type { CoolingProfile, FanCurve, ProfileSettings } from "../profile/types";
import { dutyAtTemp } from "./curve";
import { dutyToRpm } from "./rpm";

/** Duty and speed of one motor group at a given liquid temperature. */
export interface MotorState {
  dutyPct: number;
  rpm: number;
  stopped: boolean;
}

/** True when the fan curve's stop temperature applies at `tempC`. */
export function fansStoppedAt(fans: FanCurve, tempC: number): boolean {
  return fans.stopBelowTempC !== undefined && tempC < fans.stopBelowTempC;
}

/**
 * Pump duty and RPM at a steady liquid temperature: the curve duty (at or above
 * the critical temperature 100 %), converted by `dutyToRpm`. The pump never
 * stops: below its minimum duty it holds its minimum RPM.
 */
export function pumpStateAt(profile: ProfileSettings, hw: HardwareContext, tempC: number): MotorState {
  const dutyPct = tempC >= profile.criticalTempC ? 100 : dutyAtTemp(profile.pump.points, tempC);
  return { dutyPct, rpm: dutyToRpm(dutyPct, hw.pump), stopped: false };
}

/**
 * Fan duty and RPM at a steady liquid temperature: 0 RPM below the profile's
 * fan stop temperature, otherwise the curve duty (100 % at or above the
 * critical temperature) converted by `dutyToRpm`.
 */
export function fanStateAt(profile: ProfileSettings | CoolingProfile, hw: HardwareContext, tempC: number): MotorState {
  if (tempC < profile.criticalTempC && fansStoppedAt(profile.fans, tempC)) {
    return { dutyPct: 0, rpm: 0, stopped: true };
  }
  const dutyPct = tempC >= profile.criticalTempC ? 100 : dutyAtTemp(profile.fans.points, tempC);
  return { dutyPct, rpm: dutyToRpm(dutyPct, hw.fan), stopped: false };
}
