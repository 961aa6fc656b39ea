import "server-only";
import type { Database } from "@/db/client";
import { recordAudit, type AuditActor } from "@/db/audit";
import { boardModelView, countLotsOf, insertBoardModel, listRevisionsOfModel, lockBoardModel, updateBoardModelRow } from "@/db/boards";
import { AppError } from "@/lib/api/errors";

type BoardModelInput = { name: string; serialPrefix: string; description: string };

/** Registers a board model, with its audit event, in one transaction. */
export async function createBoardModel(db: Database, actor: AuditActor, input: BoardModelInput) {
  return db.transaction(async (tx) => {
    const row = await insertBoardModel(tx, input);
    await recordAudit(tx, actor, { action: "board_model.create", entityType: "board_model", entityId: row.id, after: row });
    return boardModelView(row, []);
  });
}

/**
 * Changes a board model's name, prefix or description. The serial prefix is fixed once boards
 * of the model have shipped in a production lot (409 naming the field): shipped serials carry
 * it and support looks boards up by it.
 */
export async function updateBoardModel(db: Database, actor: AuditActor, { id, ...input }: BoardModelInput & { id: string }) {
  return db.transaction(async (tx) => {
    const before = await lockBoardModel(tx, { id });
    if (!before) throw new AppError("not_found", "No such board model.");
    if (input.serialPrefix !== before.serialPrefix) {
      const lots = await countLotsOf(tx, { boardModelId: id });
      if (lots > 0) {
        throw new AppError("conflict", `Boards of this model have shipped in ${lots} production lot(s); the serial prefix cannot change.`, {
          issues: [{ path: "/serialPrefix", message: "Keep the prefix once lots exist." }],
        });
      }
    }
    const row = await updateBoardModelRow(tx, { id, ...input });
    await recordAudit(tx, actor, { action: "board_model.update", entityType: "board_model", entityId: id, before, after: row });
    return boardModelView(row, await listRevisionsOfModel(tx, { boardModelId: id }));
  });
}
