import type { MotorComponent } from "../hardware/types";

/**
 * Motor speed at a PWM duty: linear from (min duty, RPM at min duty) to
 * (100 %, max RPM); below the minimum duty the motor holds its minimum RPM.
 * This is the "holds minimum speed" behaviour of Intel, "4-Wire Pulse Width
 * Modulation (PWM) Controlled Fans Specification", Rev 1.3, §3.4; 100 % duty
 * is full speed (the signal is not inverted). Stopping is decided by the
 * caller (`fanRpmAtTemp`), never by the duty alone.
 */
export function dutyToRpm(dutyPct: number, component: MotorComponent): number {
  if (!Number.isFinite(dutyPct)) return Number.NaN;
  const duty = Math.min(100, dutyPct);
  const { minDutyPct, rpmAtMinDuty, maxRpm } = component;
  if (duty <= minDutyPct || minDutyPct >= 100) return rpmAtMinDuty;
  return rpmAtMinDuty + ((maxRpm - rpmAtMinDuty) * (duty - minDutyPct)) / (100 - minDutyPct);
}
