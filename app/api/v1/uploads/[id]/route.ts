import { apiRoute } from "@/lib/platform/http/api-route";
import { downloadUpload } from "@/lib/api/operations/builds";
import { getDb } from "@/db/client";
import { getUpload } from "@/db/uploads";
import { AppError } from "@/lib/api/errors";
import { getStorage } from "@/lib/platform/storage";
import { downloadName } from "@/lib/release/upload-check";

export const GET = apiRoute(downloadUpload, async ({ params }) => {
  const upload = await getUpload(getDb(), { id: params.id });
  if (!upload) throw new AppError("not_found", "No upload with that id.");
  const bytes = await getStorage().get(upload.storageKey);
  return new Response(new Uint8Array(bytes), {
    headers: { "content-type": upload.contentType, "content-disposition": `attachment; filename="${downloadName(upload.originalName, upload.contentType)}"`, "x-content-sha256": upload.sha256 },
  });
});
