import { EngineInputError } from "../guards/input-error";
import { DEFAULT_LARGEST_DIMENSION_MM, type HardwareContext } from "../hardware/types";

/**
 * Shortest listener distance the noise estimate is given for, m: about the largest
 * dimension of the radiator with its fans (the hardware context's
 * `radiator.largestDimensionMm`, or DEFAULT_LARGEST_DIMENSION_MM when it gives none).
 *
 * Why: the estimate treats the cooler as one point source in a free field and moves
 * levels by the inverse-square law. Closer than about the source's largest dimension
 * the listener is in the geometric near field, where the fans are at very different
 * distances and the level no longer falls by 6 dB per doubling of distance (common
 * practice in acoustics: the far field begins a few source dimensions away; the
 * "about one largest dimension" used here is the loosest form of that rule, chosen
 * so ordinary desk distances are still accepted).
 */
export function nearFieldLimitM(hw: Pick<HardwareContext, "radiator">): number {
  return (hw.radiator.largestDimensionMm ?? DEFAULT_LARGEST_DIMENSION_MM) / 1000;
}

/** Why a listener distance is refused, in words a user can act on; null when it is fine. */
export function listenerDistanceProblem(hw: Pick<HardwareContext, "radiator">, distanceM: number): string | null {
  if (!Number.isFinite(distanceM) || distanceM <= 0) return "Enter the listener distance in metres, above 0.";
  if (distanceM > 1000) return "Enter a listener distance of at most 1,000 m.";
  const limitM = nearFieldLimitM(hw);
  if (distanceM < limitM) {
    const size = hw.radiator.largestDimensionMm !== undefined ? `the radiator's largest dimension, ${hw.radiator.largestDimensionMm} mm` : `${DEFAULT_LARGEST_DIMENSION_MM} mm, assumed because the hardware gives no radiator size`;
    return `${distanceM} m is inside the cooler's near field (closer than about ${size}), where the estimate does not hold: use at least ${limitM} m.`;
  }
  return null;
}

/** Throws EngineInputError naming `distanceM` when the distance is refused (listenerDistanceProblem). */
export function requireListenerDistance(hw: Pick<HardwareContext, "radiator">, distanceM: number): number {
  const problem = listenerDistanceProblem(hw, distanceM);
  if (problem) throw new EngineInputError("distanceM", problem);
  return distanceM;
}
