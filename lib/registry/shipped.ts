/**
 * What may no longer change once boards have shipped: shipped serials carry the board
 * model's prefix (support looks boards up by it), and a revision's memory layout is what
 * the factory flashed. Pure: the use cases count the lots and decide.
 */
import { REVISION_LAYOUT_FIELDS, type RevisionLayoutField } from "./revision-fields";

/** The layout fields `next` changes from `before`, in form order. */
export function changedLayoutFields(before: Record<RevisionLayoutField, unknown>, next: Record<RevisionLayoutField, unknown>): RevisionLayoutField[] {
  return REVISION_LAYOUT_FIELDS.filter((k) => next[k] !== before[k]);
}
