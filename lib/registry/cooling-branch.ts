import type { CurveKind, HardwareContext, ProfileSettings } from "@/lib/engine";
// Engine modules directly (screens load this module): see editor-evaluation.ts.
import { dutyAtTemp } from "@/lib/speeds/curve";
import { dutyToRpm } from "@/lib/speeds/rpm";

/**
 * Pump or fan RPM while the liquid cools at `tempC`: the firmware holds the curve's
 * input at T + hysteresis (play operator, lib/transient), so the falling branch is the
 * curve read there; full speed at or above the critical temperature; fans at 0 % while
 * the held temperature is below the stop temperature (standing still only if they stop at 0 % duty).
 */
export function coolingBranchRpm(profile: ProfileSettings, hw: HardwareContext, kind: CurveKind, tempC: number): number {
  const motor = kind === "pump" ? hw.pump : hw.fan;
  if (tempC >= profile.criticalTempC) return dutyToRpm(100, motor);
  const held = tempC + profile[kind].hysteresisC;
  if (kind === "fans" && profile.fans.stopBelowTempC !== undefined && held < profile.fans.stopBelowTempC) return dutyToRpm(0, motor);
  return dutyToRpm(dutyAtTemp(profile[kind].points, held), motor);
}
