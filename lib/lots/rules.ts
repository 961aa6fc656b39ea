import type { LotInput } from "./input";
import { formatSerial, parseSerial, type Serial } from "../serials/serial";
import { lotMayName, type Stage } from "../release/stages";
import { satisfiesRange } from "../versioning/semver-helpers";

/** A lot with its natural keys resolved to rows, ready to store. */
export interface ResolvedLot {
  lotCode: string;
  boardModelId: string;
  boardRevisionId: string;
  buildId: string;
  serialFrom: number;
  serialTo: number;
  producedOn: string;
  line: string;
}

/** A problem with one field of a lot, for forms and CSV rows. */
export interface LotFieldIssue {
  field: keyof LotInput;
  message: string;
}

/** What storage found for a lot's natural keys: the board model of its serial prefix, and that model's revision and build of the given numbers. */
export interface LotKeys {
  model?: { id: string; name: string };
  revision?: { id: string; revision: string };
  build?: { id: string; version: string; stage: Stage; revisionRange: string };
}

/** Both serials of a lot, parsed; undefined when either is not PREFIX-NUMBER. */
export function lotSerials(lot: Pick<LotInput, "serialFrom" | "serialTo">): { from: Serial; to: Serial } | undefined {
  const from = parseSerial(lot.serialFrom);
  const to = parseSerial(lot.serialTo);
  return from.ok && to.ok ? { from: from.serial, to: to.serial } : undefined;
}

export const BAD_SERIALS: LotFieldIssue = { field: "serialFrom", message: "Give both serials as PREFIX-NUMBER." };

/**
 * Judges a lot against what its keys name, the rules the database cannot express simply: the
 * serial prefix names a board model, which has the revision and the build; the build is at a
 * stage the factory may flash (pilot or production); and its revision range includes the
 * board revision. Returns the lot ready to store, or the issues by field.
 */
export function resolveLotKeys(lot: LotInput, serials: { from: Serial; to: Serial }, keys: LotKeys): { resolved?: ResolvedLot; issues: LotFieldIssue[] } {
  const { model, revision, build } = keys;
  if (!model) return { issues: [{ field: "serialFrom", message: `No board model uses the serial prefix ${serials.from.prefix}.` }] };
  const issues: LotFieldIssue[] = [];
  if (!revision) issues.push({ field: "boardRevision", message: `${model.name} has no revision ${lot.boardRevision}.` });
  if (!build) issues.push({ field: "buildVersion", message: `${model.name} has no build ${lot.buildVersion}.` });
  else if (!lotMayName(build.stage)) {
    issues.push({ field: "buildVersion", message: `Build ${build.version} is at stage "${build.stage}"; lots may only name builds at pilot or production.` });
  } else if (revision && !satisfiesRange(revision.revision, build.revisionRange)) {
    issues.push({ field: "boardRevision", message: `Build ${build.version} is for board revisions ${build.revisionRange}; revision ${revision.revision} is outside it.` });
  }
  if (issues.length || !revision || !build) return { issues };
  return {
    issues,
    resolved: {
      lotCode: lot.lotCode,
      boardModelId: model.id,
      boardRevisionId: revision.id,
      buildId: build.id,
      serialFrom: serials.from.number,
      serialTo: serials.to.number,
      producedOn: lot.producedOn,
      line: lot.line,
    },
  };
}

/** What a person is told when a lot's serials overlap a recorded lot of the same board model. */
export function overlapMessage(lot: { lotCode: string; serialFrom: number; serialTo: number; prefix: string }): string {
  return `Those serials overlap lot ${lot.lotCode} (${formatSerial(lot.prefix, lot.serialFrom)} to ${formatSerial(lot.prefix, lot.serialTo)}). Serial ranges of one board model never overlap; check the range.`;
}
