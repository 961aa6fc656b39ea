import { prepareCoolerTotal } from "../acoustics/cooler-noise";
import { requireListenerDistance } from "../acoustics/near-field";
import { requireFinite } from "../guards/input-error";
import type { HardwareContext } from "../hardware/types";
import type { ProfileSettings } from "../profile/types";
import { fanStateAt, pumpStateAt } from "../speeds/at-temp";

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
 * temperature from `fromC` to `toC` (default 20–70 °C in 1 °C steps), from
 * `dutyAtTemp`, `dutyToRpm` and `coolerTotalDbA1m` (same sums as `coolerNoise`).
 * Refuses a listener distance inside the cooler's near field (requireListenerDistance).
 */
export function evaluateCurves(profile: ProfileSettings, hw: HardwareContext, options: CurveTableOptions = {}): CurveRow[] {
  const fromC = requireFinite("fromC", options.fromC ?? 20, -50, 150);
  const toC = requireFinite("toC", options.toC ?? 70, fromC, 150);
  const stepC = requireFinite("stepC", options.stepC ?? 1, 0.01, 100);
  const distanceM = requireListenerDistance(hw, requireFinite("distanceM", options.distanceM ?? 1, 0.01, 1000));
  const distanceOffsetDb = 20 * Math.log10(distanceM);
  const totalDbA1m = prepareCoolerTotal(hw);
  const rows: CurveRow[] = [];
  const count = Math.floor((toC - fromC) / stepC + 1e-9);
  for (let i = 0; i <= count; i++) {
    const tempC = fromC + i * stepC;
    const pump = pumpStateAt(profile, hw, tempC);
    const fans = fanStateAt(profile, hw, tempC);
    const soundDbA1m = totalDbA1m(fans.rpm, pump.rpm);
    rows.push({
      tempC,
      pumpDutyPct: pump.dutyPct,
      pumpRpm: pump.rpm,
      fanDutyPct: fans.dutyPct,
      fanRpm: fans.rpm,
      fansStopped: fans.stopped,
      soundDbA1m,
      soundDbAAtDistance: soundDbA1m - distanceOffsetDb,
    });
  }
  return rows;
}
