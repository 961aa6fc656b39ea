import { coolerNoise, type NoiseEstimate } from "../acoustics/cooler-noise";
import { requireListenerDistance } from "../acoustics/near-field";
import { requireFinite } from "../guards/input-error";
import { DEFAULT_STOPPED_RESISTANCE_FACTOR, type HardwareContext } from "../hardware/types";
import type { ProfileSettings } from "../profile/types";
import { fanStateAt, pumpStateAt, type MotorState } from "../speeds/at-temp";
import { coolantRiseK, pumpFlowLpm, WATER_25C, type Coolant } from "./coolant";
import { prepareRadiator } from "./resistance";

/** Bisection stops when the bracket around the liquid temperature is this narrow. */
export const DEFAULT_TOLERANCE_K = 0.001;

export interface OperatingPointOptions {
  heatLoadW: number;
  ambientC: number;
  /** Listener distance for the noise estimate, m (default 1). */
  distanceM?: number;
  coolant?: Coolant;
  /** Width of the final bracket, K (default 0.001). */
  toleranceK?: number;
}

/** Steady state of the loop at one heat load. */
export interface OperatingPoint {
  heatLoadW: number;
  ambientC: number;
  /** Steady liquid temperature, °C (middle of the final bracket). */
  liquidTempC: number;
  /** Final bracket [low, high] that holds the root, °C. */
  bracketC: [number, number];
  /** T − Tamb − P·R(N(T)) at liquidTempC, K. */
  residualK: number;
  /**
   * True when the root sits on the fan-stop step: below it the fans stop and
   * the liquid warms, at it they start and the liquid cools. The firmware then
   * cycles around the stop temperature within its hysteresis.
   */
  onFanStopStep: boolean;
  iterations: number;
  thermalResistanceKPerW: number;
  pump: MotorState;
  fans: MotorState;
  pumpFlowLpm: number;
  /** Coolant temperature rise across the cold plate, K. */
  coolantRiseK: number;
  noise: NoiseEstimate;
  /** False when the curve cannot hold this load below the critical temperature. */
  holdsBelowCritical: boolean;
}

/** g(T) = T − Tamb − P·R(N_fan(T)); non-decreasing in T, so its root is unique. */
export function heatBalanceResidualK(profile: ProfileSettings, hw: HardwareContext, heatLoadW: number, ambientC: number, tempC: number): number {
  const fanRpm = fanStateAt(profile, hw, tempC).rpm;
  return tempC - ambientC - heatLoadW * prepareRadiator(hw)(fanRpm);
}

/**
 * Steady liquid temperature for heat load P and ambient Tamb: the root of
 * T = Tamb + P·R(N_fan(T)), found by bisection to `toleranceK` (default 0.001 K).
 * R falls as the fans speed up and the fan speed does not fall as T rises, so
 * g(T) = T − Tamb − P·R(N(T)) is non-decreasing and the root is unique; the
 * bracket [Tamb + P·Rfast, Tamb + P·Rlargest] always holds it. Then: pump and fan speeds,
 * noise (see coolerNoise), pump flow V̇ ∝ N and coolant rise ΔT = Q/(ṁ·c_p)
 * (Incropera & DeWitt, 6th edition, §1.3.1, from memory). An estimate from a lumped model: a release still
 * needs lab measurement on real hardware.
 */
export function operatingPoint(profile: ProfileSettings, hw: HardwareContext, options: OperatingPointOptions): OperatingPoint {
  return solve(profile, hw, prepareRadiator(hw), options, -Infinity);
}

function solve(profile: ProfileSettings, hw: HardwareContext, resistance: (fanRpm: number) => number, options: OperatingPointOptions, loHintC: number): OperatingPoint {
  const heatLoadW = requireFinite("heatLoadW", options.heatLoadW, 0, 100_000);
  const ambientC = requireFinite("ambientC", options.ambientC, -50, 100);
  const toleranceK = requireFinite("toleranceK", options.toleranceK ?? DEFAULT_TOLERANCE_K, 1e-9, 10);
  const distanceM = requireListenerDistance(hw, requireFinite("distanceM", options.distanceM ?? 1, 0.01, 1000));
  const coolant = options.coolant ?? WATER_25C;
  const g = (tempC: number): number => tempC - ambientC - heatLoadW * resistance(fanStateAt(profile, hw, tempC).rpm);

  const rSlow = hw.radiator.thermalResistanceAtMinFanKPerW;
  const rLargest = Math.max(rSlow, hw.radiator.thermalResistanceFansStoppedKPerW ?? rSlow * DEFAULT_STOPPED_RESISTANCE_FACTOR);
  // R never falls below its max-speed value nor rises above its largest, so the root lies in
  // [Tamb + P·Rfast, Tamb + P·Rlargest]: g ≤ 0 at the low end and ≥ 0 at the high end. In a
  // sweep of rising loads the previous root is a lower bound too (the root rises with P).
  const rFast = Math.min(rSlow, hw.radiator.thermalResistanceAtMaxFanKPerW);
  let lo = ambientC + heatLoadW * rFast;
  let hi = ambientC + heatLoadW * rLargest;
  if (loHintC > lo && loHintC < hi && g(loHintC) <= 0) lo = loHintC;
  let iterations = 0;
  while (hi - lo > toleranceK && iterations < 200) {
    const mid = (lo + hi) / 2;
    if (g(mid) < 0) lo = mid;
    else hi = mid;
    iterations++;
  }
  const liquidTempC = (lo + hi) / 2;
  const residualK = g(liquidTempC);
  const stopC = profile.fans.stopBelowTempC;
  const onFanStopStep = stopC !== undefined && Math.abs(residualK) > toleranceK * 100 && Math.abs(liquidTempC - stopC) <= toleranceK;

  const pump = pumpStateAt(profile, hw, liquidTempC);
  const fans = fanStateAt(profile, hw, liquidTempC);
  const flowLpm = pumpFlowLpm(hw.pump.flowAtMaxRpmLpm, hw.pump.maxRpm, pump.rpm);
  return {
    heatLoadW,
    ambientC,
    liquidTempC,
    bracketC: [lo, hi],
    residualK,
    onFanStopStep,
    iterations,
    thermalResistanceKPerW: resistance(fans.rpm),
    pump,
    fans,
    pumpFlowLpm: flowLpm,
    coolantRiseK: coolantRiseK(heatLoadW, flowLpm, coolant),
    noise: coolerNoise(hw, fans.rpm, pump.rpm, distanceM),
    holdsBelowCritical: liquidTempC < profile.criticalTempC,
  };
}

export interface LoadSweepOptions extends Omit<OperatingPointOptions, "heatLoadW"> {
  fromW?: number;
  toW?: number;
  /** Number of loads, evenly spaced, including both ends (default 31). */
  count?: number;
}

/**
 * Operating points over a range of heat loads (default 50–350 W in 31 steps of
 * 10 W), the liquid temperatures, speeds and noise a user would live with.
 */
export function loadSweep(profile: ProfileSettings, hw: HardwareContext, options: LoadSweepOptions): OperatingPoint[] {
  const fromW = requireFinite("fromW", options.fromW ?? 50, 0, 100_000);
  const toW = requireFinite("toW", options.toW ?? 350, fromW, 100_000);
  const count = requireFinite("count", options.count ?? 31, 1, 10_000);
  const n = Math.floor(count);
  const resistance = prepareRadiator(hw);
  const out: OperatingPoint[] = [];
  let hint = -Infinity;
  for (let i = 0; i < n; i++) {
    const heatLoadW = n === 1 ? fromW : fromW + ((toW - fromW) * i) / (n - 1);
    const point = solve(profile, hw, resistance, { ...options, heatLoadW }, hint);
    hint = point.bracketC[0];
    out.push(point);
  }
  return out;
}
