import { DEFAULT_SOUND_EXPONENT, type HardwareContext, type MotorComponent } from "../hardware/types";
import { addLevelsDb, identicalSourcesDb, levelAtDistanceDb, levelAtSpeedDb } from "./levels";
import { requireListenerDistance } from "./near-field";
import { prepareSoundTable, prepareSoundTablePower } from "./sound-table";

/** Estimated A-weighted sound pressure level of a cooler. */
export interface NoiseEstimate {
  /** All fans together at 1 m, dB(A); -Infinity when stopped. */
  fansDbA: number;
  /** The pump at 1 m, dB(A). */
  pumpDbA: number;
  /** Fans and pump together at 1 m, dB(A). */
  totalDbA1m: number;
  /** Fans and pump together at the listener distance, dB(A). */
  totalDbAAtDistance: number;
  distanceM: number;
}

/**
 * Level of one unit at `rpm`, at 1 m, dB(A) (-Infinity when stopped).
 * - With a measured sound table: the table (prepareSoundTable: linear in dB over
 *   log RPM, clamped at its ends), moved from the table's distance to 1 m by the
 *   inverse-square law, +20·log10(d / 1 m).
 * - Without one (fallback): L = Lref + k·log10(N/Nref) from the reference level at
 *   1 m, k = soundExponent or 50 (see levelAtSpeedDb for the basis and its limits).
 */
export function prepareComponentLevel(component: MotorComponent): (rpm: number) => number {
  const table = component.soundTable;
  if (table) {
    const at = prepareSoundTable(table);
    const to1mDb = 20 * Math.log10(table.distanceM);
    return (rpm) => at(rpm) + to1mDb;
  }
  const exponent = component.soundExponent ?? DEFAULT_SOUND_EXPONENT;
  return (rpm) => levelAtSpeedDb(component.soundRefDbA, component.soundRefRpm, rpm, exponent);
}

/** Level of one component at `rpm`, at 1 m (prepareComponentLevel). */
export function componentLevelDbA(component: MotorComponent, rpm: number): number {
  return prepareComponentLevel(component)(rpm);
}

/**
 * Noise of the cooler: each fan's level at 1 m (componentLevelDbA), n fans
 * +10·log10(n), plus the pump, summed incoherently, then moved to the listener
 * distance by −20·log10(r / 1 m). Treats every source as a point at the same place, in a
 * free field: an estimate, not a measurement. Refuses (EngineInputError) a listener
 * distance inside the cooler's near field (requireListenerDistance).
 */
export function coolerNoise(hw: HardwareContext, fanRpm: number, pumpRpm: number, distanceM = 1): NoiseEstimate {
  requireListenerDistance(hw, distanceM);
  const fansDbA = identicalSourcesDb(componentLevelDbA(hw.fan, fanRpm), hw.fanCount);
  const pumpDbA = componentLevelDbA(hw.pump, pumpRpm);
  const totalDbA1m = addLevelsDb([fansDbA, pumpDbA]);
  return { fansDbA, pumpDbA, totalDbA1m, totalDbAAtDistance: levelAtDistanceDb(totalDbA1m, distanceM), distanceM };
}

/**
 * Total level of fans and pump at 1 m, the same result as coolerNoise's
 * totalDbA1m, computed in the power domain: Σ n·10^(L(N)/10), then 10·log10.
 */
export function coolerTotalDbA1m(hw: HardwareContext, fanRpm: number, pumpRpm: number): number {
  return prepareCoolerTotal(hw)(fanRpm, pumpRpm);
}

/** One source of prepareCoolerTotal: relative sound power of `count` units at 1 m for an RPM. */
function sourcePower(c: MotorComponent, count: number): (rpm: number) => number {
  if (c.soundTable) {
    const power = prepareSoundTablePower(c.soundTable);
    // Table levels are at the table's distance; to 1 m by the inverse-square law (×d² in power).
    const factor = count * c.soundTable.distanceM ** 2;
    return (rpm) => factor * power(rpm);
  }
  const exponent = (c.soundExponent ?? DEFAULT_SOUND_EXPONENT) / 10;
  if (!(c.soundRefRpm > 0)) return () => 0;
  const scale = (count * 10 ** (c.soundRefDbA / 10)) / c.soundRefRpm ** exponent;
  return (rpm) => (rpm > 0 ? scale * rpm ** exponent : 0);
}

/**
 * coolerTotalDbA1m with per-component constants computed once. A source costs one power
 * per call: without a sound table Lref and k are folded into one scale; with a table each
 * segment is the power law its two points imply (prepareSoundTablePower). A curve table
 * repeats speeds over long runs of rows (held below the first point, full speed from the
 * critical temperature on, stopped fans), so the last speed of each source and the last
 * total are kept and a repeat costs no power or logarithm: the same numbers, computed once.
 */
export function prepareCoolerTotal(hw: HardwareContext): (fanRpm: number, pumpRpm: number) => number {
  const fans = sourcePower(hw.fan, hw.fanCount);
  const pump = sourcePower(hw.pump, 1);
  let lastFanRpm = Number.NaN;
  let lastFanPower = 0;
  let lastPumpRpm = Number.NaN;
  let lastPumpPower = 0;
  let lastTotalDbA = Number.NaN;
  return (fanRpm, pumpRpm) => {
    const sameFans = fanRpm === lastFanRpm;
    const samePump = pumpRpm === lastPumpRpm;
    // Both speeds as last time (NaN never equals itself, so the first call computes): the last total is this one.
    if (sameFans && samePump) return lastTotalDbA;
    if (!sameFans) {
      lastFanPower = fans(fanRpm);
      lastFanRpm = fanRpm;
    }
    if (!samePump) {
      lastPumpPower = pump(pumpRpm);
      lastPumpRpm = pumpRpm;
    }
    const sum = lastFanPower + lastPumpPower;
    lastTotalDbA = sum > 0 ? 10 * Math.log10(sum) : -Infinity;
    return lastTotalDbA;
  };
}
