// No semver here: the editor screen loads this module with the page, and judges the revisions a
// range admits (lib/registry/range-match.ts, semver's range matching) only when a range is checked.

/** What a board revision offers a profile version: its points per curve, profile memory and slots. */
export interface RevisionCapacity {
  revision: string;
  maxPointsPerCurve: number;
  memoryBytes: number;
  slotCount: number;
}

/** The range a first version is offered for: every release of the board. */
export const FIRST_VERSION_BOARD_RANGE = ">=1.0.0";

/** The range the publish form starts with: the latest version's, or the first version's default. */
export function startingBoardRange(latestBoardRange: string | undefined): string {
  return latestBoardRange ?? FIRST_VERSION_BOARD_RANGE;
}

/**
 * What a range admits among the revisions it was checked against (admittedRevisions in
 * range-match.ts), judged where semver is at hand, so a screen showing it needs no range matching.
 */
export interface RangeAdmission {
  range: string;
  /** The revision numbers it was checked against. */
  checked: string[];
  /** Those it admits, in version order; null when the range is not valid. */
  admitted: string[] | null;
}

/** What a profile version needs of every revision in its range. */
export interface VersionNeeds {
  /** Points of the longer of the pump and fan curves. */
  pointsPerCurve: number;
  /** Bytes of a bank image holding this version alone. */
  encodedBytes: number;
}

export interface RevisionMisfit {
  revision: string;
  reasons: string[];
}

export interface RangeFit {
  /** Revisions of the board inside the range, in version order. */
  inRange: string[];
  /** Those that cannot hold the version, each with why. */
  misfits: RevisionMisfit[];
  /**
   * The narrowest range holding the longest run of consecutive revisions (in the declared
   * range) that all fit, newest run on a tie; null when none fits.
   */
  suggestedRange: string | null;
}

/** Why `rev` cannot hold a version with `needs`; empty when it can. */
export function misfitReasons(rev: RevisionCapacity, needs: VersionNeeds): string[] {
  const reasons: string[] = [];
  if (needs.pointsPerCurve > rev.maxPointsPerCurve) reasons.push(`a curve has ${needs.pointsPerCurve} points; it stores at most ${rev.maxPointsPerCurve}`);
  if (needs.encodedBytes > rev.memoryBytes) reasons.push(`the image takes ${needs.encodedBytes} bytes; it has ${rev.memoryBytes} bytes of profile memory`);
  if (rev.slotCount < 1) reasons.push("it has no profile slot");
  return reasons;
}

/**
 * The revisions a declared range admits (in version order, as `revisionsInRange` in
 * range-match.ts gives them), checked for points per curve, memory and slots, so a version
 * is never published for a revision that cannot hold it.
 */
export function fitAdmittedRevisions(inRange: readonly RevisionCapacity[], needs: VersionNeeds): RangeFit {
  const checked = inRange.map((r) => ({ revision: r.revision, reasons: misfitReasons(r, needs) }));
  let best: string[] = [];
  let run: string[] = [];
  for (const c of checked) {
    if (c.reasons.length === 0) run = [...run, c.revision];
    else run = [];
    if (run.length > 0 && run.length >= best.length) best = run;
  }
  const first = best[0];
  const last = best[best.length - 1];
  const suggestedRange = !first || !last ? null : first === last ? first : `>=${first} <=${last}`;
  return { inRange: checked.map((c) => c.revision), misfits: checked.filter((c) => c.reasons.length > 0), suggestedRange };
}

/** One sentence naming each revision that cannot hold the version and the range to use instead. */
export function rangeFitMessage(range: string, fit: RangeFit): string {
  const named = fit.misfits.map((m) => `revision ${m.revision} (${m.reasons.join("; ")})`).join(", ");
  const advice = fit.suggestedRange
    ? `Narrow the range to "${fit.suggestedRange}", the narrowest range whose revisions all hold it, or shorten the curves.`
    : "No revision in the range holds it; shorten the curves.";
  return `The range "${range}" includes board revisions that cannot hold this version: ${named}. ${advice}`;
}
