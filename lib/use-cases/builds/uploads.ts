import "server-only";
import { assertIdentityEncoding } from "@/lib/platform/http/raw-body";
import type { NextRequest } from "next/server";
import { getDb, type Tx } from "@/db/client";
import type { AuditActor } from "@/db/audit";
import { insertUpload } from "@/db/uploads";
import { AppError } from "@/lib/api/errors";
import { checkUploadContent, uploadNameProblem, uploadRowErrors, UPLOAD_MAX_BYTES, type UploadKind } from "@/lib/release/upload-check";
import { getStorage, type ByteSource, type Storage } from "@/lib/platform/storage";

type Uploader = AuditActor & { userId: string };
type UploadRow = Awaited<ReturnType<typeof insertUpload>>;

/**
 * Stores an upload: the name checked (it is only ever a label), the bytes streamed into
 * storage under a generated key with the kind's size limit, the type judged by content,
 * then the uploads row (and whatever `attach` does) in one transaction. Anything refused
 * leaves nothing behind: the stored object is deleted.
 */
export async function acceptUpload(
  uploader: Uploader,
  input: { kind: UploadKind; name: string; body: ByteSource | null; attach?: (tx: Tx, upload: UploadRow) => Promise<void> },
  storage: Storage = getStorage(),
): Promise<UploadRow> {
  const nameProblem = uploadNameProblem(input.name);
  if (nameProblem) throw new AppError("validation_failed", nameProblem, { issues: [{ path: "/name", message: nameProblem }] });
  if (!input.body) throw new AppError("bad_request", "Send the file's bytes as the request body.");
  const maxBytes = UPLOAD_MAX_BYTES[input.kind];
  const stored = await storage.put(input.body, { maxBytes });
  try {
    const bytes = new Uint8Array(await storage.get(stored.key));
    const content = checkUploadContent(input.kind, input.name, bytes);
    if (!content.ok) throw new AppError("unsupported_media_type", content.message);
    const rowErrors = uploadRowErrors(input.kind, bytes);
    if (rowErrors.length > 0) {
      throw new AppError("validation_failed", "The measurement CSV has rows that cannot be read, so nothing was stored. Fix the listed lines and upload it again.", {
        issues: rowErrors.map((message) => ({ path: "/file", message })),
      });
    }
    return await getDb().transaction(async (tx) => {
      const row = await insertUpload(tx, uploader, { kind: input.kind, storageKey: stored.key, originalName: input.name.trim(), contentType: content.contentType, sizeBytes: stored.sizeBytes, sha256: stored.sha256 });
      await input.attach?.(tx, row);
      return row;
    });
  } catch (err) {
    await storage.delete(stored.key).catch(() => undefined);
    throw err;
  }
}

/** The declared length, when present, refuses an oversize upload before reading it. */
export function requestBody(req: NextRequest, kind: UploadKind): ByteSource | null {
  assertIdentityEncoding(req);
  const declared = Number(req.headers.get("content-length") ?? "0");
  if (declared > UPLOAD_MAX_BYTES[kind]) throw new AppError("payload_too_large", `The file is larger than ${UPLOAD_MAX_BYTES[kind]} bytes; upload a smaller one.`);
  return req.body;
}
