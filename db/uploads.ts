import "server-only";
import { eq, inArray, sql } from "drizzle-orm";
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

/** An upload no build refers to (firmware, lab report or measurements). */
const pendingUpload = sql`not exists (select 1 from builds b where b.firmware_upload_id = u.id or b.lab_report_upload_id = u.id or b.measurements_upload_id = u.id)`;

/**
 * Bytes of a person's uploads that no build refers to. Takes a transaction-scoped lock per
 * person first, so two uploads of one person are judged one after the other.
 */
export async function pendingUploadBytes(tx: Executor, { userId }: { userId: string }): Promise<number> {
  await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${`uploads:${userId}`}))`);
  const res = await tx.execute<{ bytes: string | number }>(sql`select coalesce(sum(u.size_bytes), 0) as bytes from uploads u where u.uploaded_by_user_id = ${userId} and ${pendingUpload}`);
  return Number(res.rows[0]?.bytes ?? 0);
}

/** Deletes the rows of uploads no build refers to that arrived before `before`; returns their storage keys. */
export async function deletePendingUploads(tx: Executor, { before }: { before: Date }): Promise<{ id: string; storageKey: string }[]> {
  const res = await tx.execute<{ id: string; storage_key: string }>(sql`
    delete from uploads u where u.created_at < ${before.toISOString()} and ${pendingUpload}
    returning u.id, u.storage_key`);
  return res.rows.map((r) => ({ id: r.id, storageKey: r.storage_key }));
}
