import "server-only";
import type { Database } from "@/db/client";
import { recordAudit, type AuditActor } from "@/db/audit";
import { boardModelExists, countLotsOf, insertBoardRevision, lockBoardRevision, revisionView, updateBoardRevisionRow, type BoardRevisionInput } from "@/db/boards";
import { AppError } from "@/lib/api/errors";
import { changedLayoutFields } from "@/lib/registry/shipped";

/** Adds a revision to a board model, with its audit event, in one transaction. */
export async function createBoardRevision(db: Database, actor: AuditActor, { boardModelId, ...input }: BoardRevisionInput & { boardModelId: string }) {
  return db.transaction(async (tx) => {
    if (!(await boardModelExists(tx, { id: boardModelId }))) throw new AppError("not_found", "No such board model.");
    const row = await insertBoardRevision(tx, { ...input, boardModelId });
    await recordAudit(tx, actor, { action: "board_revision.create", entityType: "board_revision", entityId: row.id, after: row });
    return revisionView(row);
  });
}

/**
 * Changes a board revision. Once boards of the revision have shipped in a production lot only
 * its notes may change (409 naming each layout field that would): the factory flashed that
 * layout, so a different one is a new revision.
 */
export async function updateBoardRevision(db: Database, actor: AuditActor, { id, ...input }: BoardRevisionInput & { id: string }) {
  return db.transaction(async (tx) => {
    const before = await lockBoardRevision(tx, { id });
    if (!before) throw new AppError("not_found", "No such board revision.");
    const changed = changedLayoutFields(before, input);
    if (changed.length > 0) {
      const lots = await countLotsOf(tx, { boardRevisionId: id });
      if (lots > 0) {
        throw new AppError("conflict", `Boards of revision ${before.revision} have shipped in ${lots} production lot(s); only the notes can change. Add a new revision instead.`, {
          issues: changed.map((k) => ({ path: `/${k}`, message: "Fixed once boards have shipped." })),
        });
      }
    }
    const row = await updateBoardRevisionRow(tx, { id, ...input });
    await recordAudit(tx, actor, { action: "board_revision.update", entityType: "board_revision", entityId: id, before, after: row });
    return revisionView(row);
  });
}
