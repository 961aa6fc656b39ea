import "server-only";
import type { Database } from "@/db/client";
import { recordAudit, type AuditActor } from "@/db/audit";
import { getCoolerHardware, insertProfile } from "@/db/profiles";
import { AppError } from "@/lib/api/errors";
import { documentText, starterProfile } from "@/lib/registry/starter-profile";

/** Creates a profile owned by its creator, with a starter draft fitted to its cooler's fan and pump, audited, in one transaction. */
export async function createProfile(db: Database, actor: AuditActor & { userId: string }, input: { coolerModelId: string; name: string; description: string }) {
  return db.transaction(async (tx) => {
    const hw = await getCoolerHardware(tx, { coolerModelId: input.coolerModelId });
    if (!hw) throw new AppError("validation_failed", "Pick an existing cooler model.", { issues: [{ path: "/coolerModelId", message: "No such cooler model." }] });
    const draft = starterProfile({ name: input.name, description: input.description, pumpMinDutyPct: hw.pump.minDutyPct, fanMinDutyPct: hw.fan.minDutyPct });
    const row = await insertProfile(tx, { ...input, ownerUserId: actor.userId, draftText: documentText(draft), draftDocument: draft });
    await recordAudit(tx, actor, { action: "profile.create", entityType: "profile", entityId: row.id, after: { ...input, ownerUserId: actor.userId } });
    return { id: row.id, name: row.name };
  });
}
