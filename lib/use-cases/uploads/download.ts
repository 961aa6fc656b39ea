import "server-only";
import type { Executor } from "@/db/client";
import { getUpload } from "@/db/uploads";
import { AppError } from "@/lib/api/errors";
import { getStorage, type Storage } from "@/lib/platform/storage";
import { MissingObjectError } from "@/lib/platform/storage/types";

/**
 * An uploaded file with its row: 404 when no upload has that id, 410 when the row is there
 * but its bytes are no longer in storage (the row says what was uploaded, so the message
 * can name the file and what to do).
 */
export async function uploadedFile(db: Executor, { id }: { id: string }, storage: Storage = getStorage()) {
  const upload = await getUpload(db, { id });
  if (!upload) throw new AppError("not_found", "No upload with that id.");
  try {
    return { upload, bytes: await storage.get(upload.storageKey) };
  } catch (err) {
    if (err instanceof MissingObjectError) {
      throw new AppError("gone", `The stored bytes of "${upload.originalName}" (uploaded ${upload.createdAt.toISOString().slice(0, 10)}) are no longer in file storage. Upload the file again.`);
    }
    throw err;
  }
}
