import "server-only";
import type { Database, Executor } from "@/db/client";
import { recordAudit, type AuditActor } from "@/db/audit";
import { componentKinds } from "@/db/components";
import { countProfilesOf, getCoolerModelView, insertCoolerModel, lockCoolerModel, updateCoolerModelRow, type CoolerModelInput } from "@/db/cooler-models";
import { AppError } from "@/lib/api/errors";
import { forgetBuildSlots } from "@/lib/use-cases/support/build-slots";

/** The fan and pump references must name a fan and a pump; a foreign key alone cannot say which kind (422 naming the field). */
async function checkParts(tx: Executor, input: Pick<CoolerModelInput, "fanComponentId" | "pumpComponentId">) {
  const kinds = await componentKinds(tx, { ids: [input.fanComponentId, input.pumpComponentId] });
  if (kinds.get(input.fanComponentId) !== "fan") throw new AppError("validation_failed", "Pick a fan component.", { issues: [{ path: "/fanComponentId", message: "Pick a fan." }] });
  if (kinds.get(input.pumpComponentId) !== "pump") throw new AppError("validation_failed", "Pick a pump component.", { issues: [{ path: "/pumpComponentId", message: "Pick a pump." }] });
}

async function viewOf(tx: Executor, id: string) {
  const view = await getCoolerModelView(tx, { id });
  if (!view) throw new Error("the cooler model just written is not readable in its own transaction");
  return view;
}

/** Registers a cooler model from a fan and a pump on a board model, with its audit event, in one transaction. */
export async function createCoolerModel(db: Database, actor: AuditActor, input: CoolerModelInput) {
  return db.transaction(async (tx) => {
    await checkParts(tx, input);
    const row = await insertCoolerModel(tx, input);
    await recordAudit(tx, actor, { action: "cooler_model.create", entityType: "cooler_model", entityId: row.id, after: row });
    return viewOf(tx, row.id);
  });
}

/**
 * Changes a cooler model. Its board model is fixed while profiles are written for it (409):
 * profiles are versioned against board ranges of this cooler's board, so moving it would orphan them.
 */
export async function updateCoolerModel(db: Database, actor: AuditActor, { id, ...input }: CoolerModelInput & { id: string }) {
  const updated = await db.transaction(async (tx) => {
    const before = await lockCoolerModel(tx, { id });
    if (!before) throw new AppError("not_found", "No such cooler model.");
    await checkParts(tx, input);
    if (input.boardModelId !== before.boardModelId) {
      const used = await countProfilesOf(tx, { coolerModelId: id });
      if (used > 0) {
        throw new AppError("conflict", `This cooler model has ${used} profile(s) written for its board; its board model cannot change.`, {
          issues: [{ path: "/boardModelId", message: "Keep the board model while profiles exist." }],
        });
      }
    }
    const row = await updateCoolerModelRow(tx, { id, ...input });
    await recordAudit(tx, actor, { action: "cooler_model.update", entityType: "cooler_model", entityId: id, before, after: row });
    return viewOf(tx, id);
  });
  // The serial lookup shows a slot's cooler figures from memory; after the commit, not before.
  forgetBuildSlots();
  return updated;
}
