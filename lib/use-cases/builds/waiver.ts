import "server-only";
import type { Database } from "@/db/client";
import { recordAudit, type AuditActor } from "@/db/audit";
import { setWaiverReason } from "@/db/build-stages";
import { AppError } from "@/lib/api/errors";
import { lockedBuild } from "./locked";

/** A release manager accepts the lab's sound levels despite the estimate, with a reason; only during lab validation (409 otherwise). */
export async function recordWaiver(db: Database, actor: AuditActor & { userId: string }, { buildId, reason }: { buildId: string; reason: string }): Promise<{ ok: true }> {
  await db.transaction(async (tx) => {
    const build = await lockedBuild(tx, buildId);
    if (build.stage !== "validation") throw new AppError("conflict", `A waiver is recorded during lab validation; this build is in ${build.stage}.`);
    await setWaiverReason(tx, { buildId, reason });
    await recordAudit(tx, actor, { action: "build.waiver", entityType: "build", entityId: buildId, before: { waiverReason: build.waiverReason }, after: { waiverReason: reason } });
  });
  return { ok: true };
}
