import "server-only";
import type { Database } from "@/db/client";
import type { AuditActor } from "@/db/audit";
import { importLots, type ImportProgress } from "@/db/lots";
import { parseLotsCsv } from "@/lib/lots/csv";
import type { ImportResult } from "@/lib/api/operations/support";

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
