import type { HardwareContext } from "../hardware/types";
import type { CoolingProfile, FanCurve, ProfileSettings } from "../profile/types";
import { dutyAtTemp } from "./curve";
import { dutyToRpm } from "./rpm";

/** Duty and speed of one motor group at a given liquid temperature. */
export interface MotorState {
  dutyPct: number;
  rpm: number;
  /** The motors stand still (0 RPM). */
  stopped: boolean;
}

/** True when the fan curve's stop temperature applies at `tempC` (the firmware outputs 0 % to the fans). */
export function fansStoppedAt(fans: FanCurve, tempC: number): boolean {
  return fans.stopBelowTempC !== undefined && tempC < fans.stopBelowTempC;
}

/**
 * Pump duty and RPM at a steady liquid temperature: the curve duty (at or above
 * the critical temperature 100 %), converted by `dutyToRpm`. Below its minimum
 * duty the pump holds its minimum RPM (a 0 % pump point is refused by validation).
 */
export function pumpStateAt(profile: ProfileSettings, hw: HardwareContext, tempC: number): MotorState {
  const dutyPct = tempC >= profile.criticalTempC ? 100 : dutyAtTemp(profile.pump.points, tempC);
  const rpm = dutyToRpm(dutyPct, hw.pump);
  return { dutyPct, rpm, stopped: rpm === 0 };
}

/**
 * Fan duty and RPM at a steady liquid temperature: 0 % below the profile's fan
 * stop temperature, otherwise the curve duty (100 % at or above the critical
 * temperature), converted by `dutyToRpm`. What 0 % (or a duty below the minimum)
 * does depends on the fan: one that stops at 0 % duty stands still, one that holds
 * its minimum speed keeps turning at it (Intel 4-wire PWM fan spec rev. 1.3 §3.4).
 */
export function fanStateAt(profile: ProfileSettings | CoolingProfile, hw: HardwareContext, tempC: number): MotorState {
  const dutyPct = tempC >= profile.criticalTempC ? 100 : fansStoppedAt(profile.fans, tempC) ? 0 : dutyAtTemp(profile.fans.points, tempC);
  const rpm = dutyToRpm(dutyPct, hw.fan);
  return { dutyPct, rpm, stopped: rpm === 0 };
}
