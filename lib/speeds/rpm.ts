import type { MotorComponent } from "../hardware/types";

/**
 * Motor speed at a PWM duty: linear from (min duty, RPM at min duty) to
 * (100 %, max RPM); 100 % duty is full speed (the signal is not inverted).
 * Below the minimum duty Intel, "4-Wire Pulse Width Modulation (PWM) Controlled
 * Fans", rev. 1.3, §3.4 allows two kinds of motor, which the component declares:
 * - `stopsAtZeroDuty` false (the default): it keeps its minimum speed at every
 *   duty below the minimum, 0 % included — a 0 % output does not stop it;
 * - `stopsAtZeroDuty` true: it stops (0 RPM) at 0 % duty and keeps its minimum
 *   speed between 0 % and the minimum duty.
 * A fan stop of the profile is a 0 % output: whether the fans really stand still
 * is decided here, by the component.
 */
export function dutyToRpm(dutyPct: number, component: MotorComponent): number {
  if (!Number.isFinite(dutyPct)) return Number.NaN;
  if (dutyPct <= 0 && component.stopsAtZeroDuty === true) return 0;
  const duty = Math.min(100, dutyPct);
  const { minDutyPct, rpmAtMinDuty, maxRpm } = component;
  if (duty <= minDutyPct || minDutyPct >= 100) return rpmAtMinDuty;
  return rpmAtMinDuty + ((maxRpm - rpmAtMinDuty) * (duty - minDutyPct)) / (100 - minDutyPct);
}

/** Speed of a motor the firmware outputs 0 % to (the profile's fan stop): 0 when it stops at 0 % duty, otherwise its minimum speed. */
export function rpmAtZeroDuty(component: MotorComponent): number {
  return dutyToRpm(0, component);
}
