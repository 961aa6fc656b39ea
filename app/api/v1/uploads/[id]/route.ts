import { apiRoute } from "@/lib/platform/http/api-route";
import { downloadUpload } from "@/lib/api/operations/builds";
import { getDb } from "@/db/client";
import { getUpload } from "@/db/uploads";
import { AppError } from "@/lib/api/errors";
import { getStorage } from "@/lib/platform/storage";

/** The stored name is a label only: it is quoted and stripped of anything but safe characters. */
function dispositionName(name: string): string {
  return name.replace(/[^A-Za-z0-9._ -]/g, "_").slice(0, 120) || "download";
}

export const GET = apiRoute(downloadUpload, async ({ params }) => {
  const upload = await getUpload(getDb(), { id: params.id });
  if (!upload) throw new AppError("not_found", "No upload with that id.");
  const bytes = await getStorage().get(upload.storageKey);
  return new Response(new Uint8Array(bytes), {
    headers: { "content-type": upload.contentType, "content-disposition": `attachment; filename="${dispositionName(upload.originalName)}"`, "x-content-sha256": upload.sha256 },
  });
});
