import { DEFAULT_STOPPED_RESISTANCE_FACTOR, type HardwareContext } from "../hardware/types";

/**
 * Exponent of the air-side law. Forced-convection heat transfer over fins
 * grows roughly with air velocity^0.8 in turbulent flow (Dittus–Boelter-type
 * correlations, Nu ∝ Re^0.8; Incropera & DeWitt, "Fundamentals of Heat and Mass
 * Transfer", 6th edition, §8.5, eq. 8.60 — section and equation from memory; a
 * modelling choice for fin banks, not a published radiator law), and fan airflow is
 * proportional to speed (fan laws, ASHRAE Handbook — HVAC Systems and Equipment, 2020
 * edition, ch. 21 "Fans", from memory), so the
 * speed-dependent part of the resistance falls as N^-0.8.
 */
export const AIR_SIDE_EXPONENT = 0.8;

/**
 * Liquid-to-ambient thermal resistance of the radiator at fan speed `fanRpm`.
 *
 * Law chosen: R is linear in N^-0.8 between the two given anchors,
 *   R(N) = Rmax + (Rmin − Rmax)·(N^-0.8 − Nmax^-0.8) / (Nmin^-0.8 − Nmax^-0.8),
 * where Rmin/Rmax are the resistances at minimum/maximum fan speed. Why: R is a
 * fixed part (liquid side, fin conduction) plus an air-side part ∝ 1/h, and
 * h ∝ N^0.8 (see AIR_SIDE_EXPONENT). The law passes exactly through both
 * anchors, falls monotonically with speed and flattens at high speed, as
 * measured radiator curves do. Below the minimum speed it is clamped to the
 * min-speed value; with fans stopped (rpm ≤ 0) it is the stopped resistance
 * (given, or DEFAULT_STOPPED_RESISTANCE_FACTOR × the min-speed value).
 */
export function radiatorResistanceKPerW(hw: HardwareContext, fanRpm: number): number {
  return prepareRadiator(hw)(fanRpm);
}

/**
 * radiatorResistanceKPerW with the anchor terms computed once: one power per
 * call, for the bisection loop of the operating point.
 */
export function prepareRadiator(hw: HardwareContext): (fanRpm: number) => number {
  const { thermalResistanceAtMinFanKPerW: rSlow, thermalResistanceAtMaxFanKPerW: rFast } = hw.radiator;
  const rStopped = hw.radiator.thermalResistanceFansStoppedKPerW ?? rSlow * DEFAULT_STOPPED_RESISTANCE_FACTOR;
  const nMin = hw.fan.rpmAtMinDuty;
  const nMax = hw.fan.maxRpm;
  if (!(nMax > nMin)) return (fanRpm) => (!(fanRpm > 0) ? rStopped : fanRpm >= nMax ? rFast : rSlow);
  const xMin = nMin ** -AIR_SIDE_EXPONENT;
  const xMax = nMax ** -AIR_SIDE_EXPONENT;
  const slope = (rSlow - rFast) / (xMin - xMax);
  return (fanRpm) => {
    if (!(fanRpm > 0)) return rStopped;
    if (fanRpm <= nMin) return rSlow;
    if (fanRpm >= nMax) return rFast;
    return rFast + slope * (fanRpm ** -AIR_SIDE_EXPONENT - xMax);
  };
}
