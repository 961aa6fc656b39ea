import { DUTY_STEP_PCT } from "../bank/layout";
import type { HardwareContext } from "../hardware/types";
import { dutyToRpm } from "../speeds/rpm";
import type { SlotCodes } from "./codes";
import { steadyDutyCodes } from "./control";

/** Pump and fan duty and speed the board runs at a steady temperature. */
export interface FlashedState {
  pumpDutyPct: number;
  pumpRpm: number;
  fanDutyPct: number;
  fanRpm: number;
  /** The firmware outputs 0 % to the fans (fan stop); they stand still only if the fan stops at 0 % duty (`fanRpm` says). */
  fansStopped: boolean;
}

/**
 * What the board runs at a steady liquid temperature, from the stored codes and the
 * same integer control law as the firmware vectors (`steadyDutyCodes`, the reading
 * rounded to 0.1 °C), converted to RPM by `dutyToRpm` (which knows whether the fan
 * stops at 0 % duty or holds its minimum speed). The editor's as-flashed curve.
 */
export function flashedStateAt(codes: SlotCodes, hw: HardwareContext, tempC: number): FlashedState {
  const d = steadyDutyCodes(codes, Math.round(tempC * 10));
  const pumpDutyPct = d.pumpDutyCode * DUTY_STEP_PCT;
  const fanDutyPct = d.fanDutyCode * DUTY_STEP_PCT;
  return { pumpDutyPct, pumpRpm: dutyToRpm(pumpDutyPct, hw.pump), fanDutyPct, fanRpm: dutyToRpm(fanDutyPct, hw.fan), fansStopped: d.fansStopped };
}
