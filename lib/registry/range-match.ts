// semver's own function modules, not its index. Screens load this module on demand, when a
// range is checked; the server and the demo seed import it directly.
import compare from "semver/functions/compare";
import valid from "semver/functions/valid";
import { isValidRange, satisfiesRange } from "@/lib/versioning/semver-helpers";
import { fitAdmittedRevisions, type RangeAdmission, type RangeFit, type RevisionCapacity, type VersionNeeds } from "./range-fit";

/** The revisions `range` admits, in version order (semver precedence; invalid revision numbers are never admitted). */
export function revisionsInRange<R extends Pick<RevisionCapacity, "revision">>(range: string, revisions: readonly R[]): R[] {
  return revisions.filter((r) => valid(r.revision) && satisfiesRange(r.revision, range)).sort((a, b) => compare(a.revision, b.revision));
}

/**
 * The revision numbers a range typed by a person admits, in version order; null while it is
 * empty or not (yet) a valid range (the range is trimmed first, as publishing reads it).
 */
export function admittedRevisions(range: string | null, revisions: readonly Pick<RevisionCapacity, "revision">[]): string[] | null {
  const trimmed = range?.trim() ?? "";
  if (trimmed === "" || !isValidRange(trimmed)) return null;
  return revisionsInRange(trimmed, revisions).map((r) => r.revision);
}

/** `admittedRevisions` with what it was checked against, for a screen to use without semver. */
export function rangeAdmission(range: string, revisions: readonly Pick<RevisionCapacity, "revision">[]): RangeAdmission {
  return { range: range.trim(), checked: revisions.map((r) => r.revision), admitted: admittedRevisions(range, revisions) };
}

/**
 * Every board revision a declared range admits, checked for points per curve, memory and
 * slots, so a version is never published for a revision that cannot hold it.
 */
export function fitRange(range: string, revisions: readonly RevisionCapacity[], needs: VersionNeeds): RangeFit {
  return fitAdmittedRevisions(revisionsInRange(range, revisions), needs);
}
