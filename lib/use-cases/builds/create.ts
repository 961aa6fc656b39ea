import "server-only";
import type { Database } from "@/db/client";
import { recordAudit, type AuditActor } from "@/db/audit";
import { insertBuild } from "@/db/builds";
import { getUpload } from "@/db/uploads";
import { AppError } from "@/lib/api/errors";
import { checkSlots } from "./check";

/**
 * Creates a draft build: the chosen profile versions are checked and encoded into the bank by
 * the engine for every board revision in the range (422 naming the first problem), the
 * firmware must be a firmware upload (422), then the build, its slots, its bank image and its
 * audit event are written in one transaction.
 */
export async function createBuild(
  db: Database,
  author: AuditActor & { userId: string },
  input: { boardModelId: string; version: string; revisionRange: string; firmwareUploadId: string; slots: string[] },
) {
  const { check } = await checkSlots(db, { boardModelId: input.boardModelId, revisionRange: input.revisionRange, profileVersionIds: input.slots });
  if (!check.ok) {
    throw new AppError("validation_failed", `The build does not fit: ${check.issues[0]}`, { issues: check.issues.map((message) => ({ path: "/slots", message })) });
  }
  const bank = { image: check.image, bankBytes: check.bankBytes, sha256: check.sha256, crc32: check.crc32 };
  const build = await db.transaction(async (tx) => {
    const firmware = await getUpload(tx, { id: input.firmwareUploadId });
    if (firmware?.kind !== "firmware") {
      throw new AppError("validation_failed", "Upload the firmware image first; that upload is not a firmware image.", { issues: [{ path: "/firmwareUploadId", message: "Not a firmware upload." }] });
    }
    const row = await insertBuild(tx, { ...input, authorUserId: author.userId, profileVersionIds: input.slots, bank });
    await recordAudit(tx, author, {
      action: "build.create",
      entityType: "build",
      entityId: row.id,
      after: { version: input.version, revisionRange: input.revisionRange, slots: input.slots, bankSha256: bank.sha256, bankBytes: bank.bankBytes },
    });
    return row;
  });
  return { build };
}
