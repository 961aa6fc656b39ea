import "server-only";
import type { Database } from "@/db/client";
import { recordAudit, type AuditActor } from "@/db/audit";
import { insertComponent, lockComponent, updateComponentRow, type ComponentInput } from "@/db/components";
import { AppError } from "@/lib/api/errors";
import { forgetBuildSlots } from "@/lib/use-cases/support/build-slots";

/** Registers a fan or pump, with its audit event, in one transaction. */
export async function createComponent(db: Database, actor: AuditActor, input: ComponentInput) {
  return db.transaction(async (tx) => {
    const row = await insertComponent(tx, input);
    await recordAudit(tx, actor, { action: "component.create", entityType: "component", entityId: row.id, after: row });
    return row;
  });
}

/** Changes a fan or pump, audited with before and after; the serial lookup shows the new figures at once. */
export async function updateComponent(db: Database, actor: AuditActor, { id, ...input }: ComponentInput & { id: string }) {
  const updated = await db.transaction(async (tx) => {
    const before = await lockComponent(tx, { id });
    if (!before) throw new AppError("not_found", "No such component.");
    const row = await updateComponentRow(tx, { id, ...input });
    await recordAudit(tx, actor, { action: "component.update", entityType: "component", entityId: id, before, after: row });
    return row;
  });
  // The serial lookup shows a slot's fan and pump figures from memory; after the commit, not before.
  forgetBuildSlots();
  return updated;
}
