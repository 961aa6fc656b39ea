import { DEFAULT_SOUND_EXPONENT, type HardwareContext, type MotorComponent } from "../hardware/types";
import { addLevelsDb, identicalSourcesDb, levelAtDistanceDb, levelAtSpeedDb } from "./levels";

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

/** Level of one component at `rpm`, at 1 m: fan-law scaling from its reference point. */
export function componentLevelDbA(component: MotorComponent, rpm: number): number {
  return levelAtSpeedDb(component.soundRefDbA, component.soundRefRpm, rpm, component.soundExponent ?? DEFAULT_SOUND_EXPONENT);
}

/**
 * Noise of the cooler: each fan by L = Lref + k·log10(N/Nref), n fans +10·log10(n),
 * plus the pump, summed incoherently, then moved to the listener distance by
 * −20·log10(r / 1 m). Treats every source as a point at the same place, in a
 * free field: an estimate, not a measurement.
 */
export function coolerNoise(hw: HardwareContext, fanRpm: number, pumpRpm: number, distanceM = 1): NoiseEstimate {
  const fansDbA = identicalSourcesDb(componentLevelDbA(hw.fan, fanRpm), hw.fanCount);
  const pumpDbA = componentLevelDbA(hw.pump, pumpRpm);
  const totalDbA1m = addLevelsDb([fansDbA, pumpDbA]);
  return { fansDbA, pumpDbA, totalDbA1m, totalDbAAtDistance: levelAtDistanceDb(totalDbA1m, distanceM), distanceM };
}

/**
 * Total level of fans and pump at 1 m, the same result as coolerNoise's
 * totalDbA1m, computed in the power domain: Σ n·10^(Lref/10)·(N/Nref)^(k/10),
 * then 10·log10.
 */
export function coolerTotalDbA1m(hw: HardwareContext, fanRpm: number, pumpRpm: number): number {
  return prepareCoolerTotal(hw)(fanRpm, pumpRpm);
}

/** coolerTotalDbA1m with per-component constants computed once: two powers and one logarithm per call. */
export function prepareCoolerTotal(hw: HardwareContext): (fanRpm: number, pumpRpm: number) => number {
  const source = (c: MotorComponent, count: number): ((rpm: number) => number) => {
    const exponent = (c.soundExponent ?? DEFAULT_SOUND_EXPONENT) / 10;
    if (!(c.soundRefRpm > 0)) return () => 0;
    const scale = (count * 10 ** (c.soundRefDbA / 10)) / c.soundRefRpm ** exponent;
    return (rpm) => (rpm > 0 ? scale * rpm ** exponent : 0);
  };
  const fans = source(hw.fan, hw.fanCount);
  const pump = source(hw.pump, 1);
  return (fanRpm, pumpRpm) => {
    const sum = fans(fanRpm) + pump(pumpRpm);
    return sum > 0 ? 10 * Math.log10(sum) : -Infinity;
  };
}
