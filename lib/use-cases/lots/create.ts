import "server-only";
import type { Database } from "@/db/client";
import { recordAudit, type AuditActor } from "@/db/audit";
import { isConstraintFailure } from "@/db/errors";
import { findOverlappingLot, insertLot, listLots } from "@/db/lots";
import { AppError } from "@/lib/api/errors";
import type { LotView } from "@/lib/api/operations/support";
import type { LotInput } from "@/lib/lots/input";
import { overlapMessage, type ResolvedLot } from "@/lib/lots/rules";
import { toLotView } from "./lot-view";
import { resolveLot } from "./resolve";

/**
 * Records one production lot with its audit event, in one transaction: its keys resolved and
 * judged by the lot rules (422 naming the field), the build share-locked until the insert. An
 * overlapping serial range is refused by PostgreSQL's exclusion constraint and answered with
 * the lot in the way (409).
 */
export async function createLot(db: Database, actor: AuditActor, lot: LotInput): Promise<{ lot: LotView }> {
  let attempted: ResolvedLot | undefined;
  let id: string;
  try {
    id = await db.transaction(async (tx) => {
      const { resolved, issues } = await resolveLot(tx, lot, { lockBuild: true });
      if (!resolved) {
        throw new AppError("validation_failed", issues[0]?.message ?? "The lot is not valid.", { issues: issues.map((i) => ({ path: `/${i.field}`, message: i.message })) });
      }
      attempted = resolved;
      const row = await insertLot(tx, resolved);
      await recordAudit(tx, actor, { action: "lot.create", entityType: "production_lot", entityId: row.id, after: row });
      return row.id;
    });
  } catch (err) {
    // The transaction is rolled back by now, so the lot in the way can be read.
    if (attempted && isConstraintFailure(err, "exclusion")) {
      const other = await findOverlappingLot(db, attempted);
      throw new AppError("conflict", other ? overlapMessage(other) : "Those serials overlap an existing lot of this board model.");
    }
    throw err;
  }
  const [row] = await listLots(db, { lotId: id, sort: "serial", dir: "asc", limit: 1, offset: 0 });
  if (!row) throw new AppError("internal", "The lot was recorded but could not be read back.");
  return { lot: toLotView(row) };
}
