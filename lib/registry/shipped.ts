/**
 * What may no longer change once boards have shipped: shipped serials carry the board
 * model's prefix (support looks boards up by it), and a revision's memory layout is what
 * the factory flashed. Pure: the use cases count the lots and decide.
 */

/** Fields of a board revision that describe the flashed memory layout. */
export const LAYOUT_FIELDS = ["revision", "memoryBytes", "baseAddress", "slotCount", "maxPointsPerCurve", "pwmFrequencyHz", "tachPulsesPerRev"] as const;
export type LayoutField = (typeof LAYOUT_FIELDS)[number];

/** The layout fields `next` changes from `before`, in form order. */
export function changedLayoutFields(before: Record<LayoutField, unknown>, next: Record<LayoutField, unknown>): LayoutField[] {
  return LAYOUT_FIELDS.filter((k) => next[k] !== before[k]);
}
