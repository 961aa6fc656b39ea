import "server-only";
import type { Database } from "@/db/client";
import { recordAuditMany, type AuditActor } from "@/db/audit";
import { isConstraintFailure } from "@/db/errors";
import { findOverlappingLots, insertLots, lotCodesTaken } from "@/db/lots";
import { AppError } from "@/lib/api/errors";
import type { ImportResult } from "@/lib/api/operations/support";
import { parseLotsCsv } from "@/lib/lots/csv";
import type { LotInput } from "@/lib/lots/input";
import { lotSerials, overlapMessage, type LotFieldIssue, type ResolvedLot } from "@/lib/lots/rules";
import { resolveLot } from "./resolve";

export interface LotRowIssue {
  row: number;
  column: string;
  message: string;
}

/** How far an import has got, for a progress bar: rows checked against the database, then rows written. */
export interface ImportProgress {
  phase: "checking" | "writing";
  done: number;
  total: number;
}

/** Thrown between batches when the client has gone (cancelled); the transaction rolls back. */
export class ImportCancelled extends Error {
  constructor() {
    super("The import was cancelled; nothing was recorded.");
  }
}

const COLUMN_OF: Record<keyof LotInput, string> = {
  lotCode: "lot_code",
  boardRevision: "board_revision",
  buildVersion: "build_version",
  serialFrom: "serial_from",
  serialTo: "serial_to",
  producedOn: "produced_on",
  line: "line",
};

/** Thrown inside the transaction to roll back a dry run or a file with bad rows. */
class RollBack extends Error {
  constructor(readonly issues: LotRowIssue[]) {
    super("roll back");
  }
}

/** Rows checked and written per statement: 1,000 lots × 7 columns stays far below PostgreSQL's 65,535 parameters. */
const IMPORT_BATCH = 1000;

/**
 * Checks parsed CSV rows against the database (board, revision, build stage and range,
 * existing lot codes and overlapping lots) and, unless this is a dry run, inserts them all in
 * ONE transaction with one audit event per lot. Any bad row means nothing is written; the
 * issues name row, column and problem.
 *
 * Built for files of 100,000 lots: the natural keys (prefix, revision, build version) are
 * looked up once per distinct combination, lot codes and overlaps are checked a batch at a
 * time, and lots and their audit events are inserted a batch per statement. `onProgress`
 * hears after each batch; an aborted `signal` stops between batches and rolls everything back.
 */
export async function importLots(
  db: Database,
  actor: AuditActor,
  { rows, dryRun, onProgress, signal }: { rows: { row: number; lot: LotInput }[]; dryRun: boolean; onProgress?: (p: ImportProgress) => void | Promise<void>; signal?: AbortSignal },
): Promise<{ issues: LotRowIssue[]; committed: number; checked: number }> {
  const stopIfCancelled = () => {
    if (signal?.aborted) throw new ImportCancelled();
  };
  try {
    const committed = await db.transaction(async (tx) => {
      const issues: LotRowIssue[] = [];
      const ready: { row: number; lot: ResolvedLot }[] = [];
      // One lookup per distinct (prefix, revision, build version); a factory file repeats a handful.
      const keyed = new Map<string, Promise<{ resolved?: ResolvedLot; issues: LotFieldIssue[] }>>();
      for (let at = 0; at < rows.length; at += IMPORT_BATCH) {
        stopIfCancelled();
        const batch: { row: number; lot: ResolvedLot }[] = [];
        for (const { row, lot } of rows.slice(at, at + IMPORT_BATCH)) {
          const serials = lotSerials(lot);
          const key = `${serials ? serials.from.prefix : lot.serialFrom}\u0000${lot.boardRevision}\u0000${lot.buildVersion}`;
          let pending = keyed.get(key);
          if (!pending) {
            pending = resolveLot(tx, lot, { lockBuild: !dryRun });
            keyed.set(key, pending);
          }
          const { resolved, issues: found } = await pending;
          for (const i of found) issues.push({ row, column: COLUMN_OF[i.field], message: i.message });
          if (!resolved || !serials) continue;
          batch.push({ row, lot: { ...resolved, lotCode: lot.lotCode, serialFrom: serials.from.number, serialTo: serials.to.number, producedOn: lot.producedOn, line: lot.line } });
        }
        const taken = await lotCodesTaken(tx, { codes: batch.map((b) => b.lot.lotCode) });
        const overlaps = await findOverlappingLots(tx, batch.map((b) => b.lot));
        batch.forEach((b, i) => {
          const dup = taken.has(b.lot.lotCode);
          if (dup) issues.push({ row: b.row, column: "lot_code", message: `Lot ${b.lot.lotCode} is already recorded.` });
          const other = overlaps.get(i);
          if (other) issues.push({ row: b.row, column: "serial_from", message: overlapMessage(other) });
          if (!dup && !other) ready.push(b);
        });
        await onProgress?.({ phase: "checking", done: Math.min(at + IMPORT_BATCH, rows.length), total: rows.length });
      }
      if (issues.length || dryRun) throw new RollBack(issues);
      for (let at = 0; at < ready.length; at += IMPORT_BATCH) {
        stopIfCancelled();
        const inserted = await insertLots(tx, ready.slice(at, at + IMPORT_BATCH).map((r) => r.lot));
        await recordAuditMany(tx, actor, inserted.map((lot) => ({ action: "lot.import", entityType: "production_lot", entityId: lot.id, after: lot })));
        await onProgress?.({ phase: "writing", done: Math.min(at + IMPORT_BATCH, ready.length), total: ready.length });
      }
      stopIfCancelled();
      return ready.length;
    });
    return { issues: [], committed, checked: rows.length };
  } catch (err) {
    if (err instanceof RollBack) return { issues: err.issues.sort((a, b) => a.row - b.row), committed: 0, checked: rows.length };
    if (isConstraintFailure(err, "exclusion")) throw new AppError("conflict", "Another lot overlapping these serials was recorded at the same moment; nothing was imported. Run the preview again.");
    throw err;
  }
}

/**
 * A lots CSV preview (dryRun) or commit: parse and check every row, then write all lots and
 * their audit events in one transaction, or none when any row is wrong. Rows with format
 * errors stop it before the database is asked anything.
 */
export async function importLotsCsv(
  db: Database,
  actor: AuditActor,
  { csv, dryRun, onProgress, signal }: { csv: string; dryRun: boolean; onProgress?: (p: ImportProgress) => void; signal?: AbortSignal },
): Promise<ImportResult> {
  const parsed = parseLotsCsv(csv);
  if (parsed.issues.length) return { dryRun, checked: parsed.rows.length, committed: 0, issues: parsed.issues };
  return { dryRun, ...(await importLots(db, actor, { rows: parsed.rows, dryRun, onProgress, signal })) };
}
