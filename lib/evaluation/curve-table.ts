import { prepareCoolerTotal } from "../acoustics/cooler-noise";
import { requireListenerDistance } from "../acoustics/near-field";
import { requireFinite } from "../guards/input-error";
import type { HardwareContext } from "../hardware/types";
import type { ProfileSettings } from "../profile/types";
import { CurveReader } from "../speeds/curve";
import * as rpm from "../speeds/rpm";

// Read once: where this file runs as CommonJS (tsx, bundlers in development) every use of an
// imported name is a getter call, and this runs twice per row.
const { dutyToRpm } = rpm;

/** One row of the temperature → speed → noise table a profile is plotted from. */
export interface CurveRow {
  tempC: number;
  pumpDutyPct: number;
  pumpRpm: number;
  fanDutyPct: number;
  fanRpm: number;
  /** The fans stand still (0 % to a fan that stops at 0 % duty); a fan that keeps its minimum speed never does. */
  fansStopped: boolean;
  /** Fans and pump together at 1 m, dB(A). */
  soundDbA1m: number;
  /** Fans and pump together at the listener distance, dB(A). */
  soundDbAAtDistance: number;
}

export interface CurveTableOptions {
  fromC?: number;
  toC?: number;
  stepC?: number;
  distanceM?: number;
}

/**
 * Steady-state pump and fan duty, RPM and estimated noise at each liquid
 * temperature from `fromC` to `toC` (default 20–70 °C in 1 °C steps): each row is
 * what `pumpStateAt`, `fanStateAt` and `coolerTotalDbA1m` (same sums as `coolerNoise`)
 * give at its temperature, computed in one pass — the curves are walked once
 * (CurveReader) and nothing is allocated per row but the row.
 * Refuses a listener distance inside the cooler's near field (requireListenerDistance).
 */
export function evaluateCurves(profile: ProfileSettings, hw: HardwareContext, options: CurveTableOptions = {}): CurveRow[] {
  const fromC = requireFinite("fromC", options.fromC ?? 20, -50, 150);
  const toC = requireFinite("toC", options.toC ?? 70, fromC, 150);
  const stepC = requireFinite("stepC", options.stepC ?? 1, 0.01, 100);
  const distanceM = requireListenerDistance(hw, requireFinite("distanceM", options.distanceM ?? 1, 0.01, 1000));
  const distanceOffsetDb = 20 * Math.log10(distanceM);
  const totalDbA1m = prepareCoolerTotal(hw);
  const pumpCurve = new CurveReader(profile.pump.points);
  const fanCurve = new CurveReader(profile.fans.points);
  const { criticalTempC } = profile;
  const { stopBelowTempC } = profile.fans;
  const rows: CurveRow[] = [];
  const count = Math.floor((toC - fromC) / stepC + 1e-9);
  for (let i = 0; i <= count; i++) {
    const tempC = fromC + i * stepC;
    // pumpStateAt and fanStateAt (lib/speeds/at-temp.ts): 100 % from the critical temperature on; 0 % to the fans below their stop temperature.
    const critical = tempC >= criticalTempC;
    const pumpDutyPct = critical ? 100 : pumpCurve.dutyAt(tempC);
    const fanDutyPct = critical ? 100 : stopBelowTempC !== undefined && tempC < stopBelowTempC ? 0 : fanCurve.dutyAt(tempC);
    const pumpRpm = dutyToRpm(pumpDutyPct, hw.pump);
    const fanRpm = dutyToRpm(fanDutyPct, hw.fan);
    const soundDbA1m = totalDbA1m(fanRpm, pumpRpm);
    rows.push({
      tempC,
      pumpDutyPct,
      pumpRpm,
      fanDutyPct,
      fanRpm,
      fansStopped: fanRpm === 0,
      soundDbA1m,
      soundDbAAtDistance: soundDbA1m - distanceOffsetDb,
    });
  }
  return rows;
}
