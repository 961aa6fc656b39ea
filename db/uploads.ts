import "server-only";
import { eq, inArray } from "drizzle-orm";
import { uploads } from "./schema";
import type { Executor } from "./client";
import { recordAudit, type AuditActor } from "./audit";
import type { UploadKind } from "@/lib/release/upload-check";

export const uploadView = {
  id: uploads.id,
  kind: uploads.kind,
  originalName: uploads.originalName,
  contentType: uploads.contentType,
  sizeBytes: uploads.sizeBytes,
  sha256: uploads.sha256,
  createdAt: uploads.createdAt,
};

/** Records a stored file; call inside the transaction that uses it, with its audit event. */
export async function insertUpload(
  tx: Executor,
  actor: AuditActor,
  input: { kind: UploadKind; storageKey: string; originalName: string; contentType: string; sizeBytes: number; sha256: string },
) {
  const [row] = await tx.insert(uploads).values({ ...input, uploadedByUserId: actor.userId }).returning(uploadView);
  if (!row) throw new Error("upload row not inserted");
  await recordAudit(tx, actor, { action: "upload.create", entityType: "upload", entityId: row.id, after: { kind: row.kind, originalName: row.originalName, sizeBytes: row.sizeBytes, sha256: row.sha256 } });
  return row;
}

export async function getUpload(db: Executor, { id }: { id: string }) {
  const [row] = await db.select({ ...uploadView, storageKey: uploads.storageKey }).from(uploads).where(eq(uploads.id, id)).limit(1);
  return row;
}

export async function getUploads(db: Executor, { ids }: { ids: string[] }) {
  if (ids.length === 0) return [];
  return db.select(uploadView).from(uploads).where(inArray(uploads.id, ids));
}
