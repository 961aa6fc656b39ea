import { apiRoute } from "@/lib/platform/http/api-route";
import { downloadUpload } from "@/lib/api/operations/builds";
import { getDb } from "@/db/client";
import { uploadedFile } from "@/lib/use-cases/uploads/download";

/** The stored name is a label only: it is quoted and stripped of anything but safe characters. */
function dispositionName(name: string): string {
  return name.replace(/[^A-Za-z0-9._ -]/g, "_").slice(0, 120) || "download";
}

export const GET = apiRoute(downloadUpload, async ({ params }) => {
  const { upload, bytes } = await uploadedFile(getDb(), { id: params.id });
  return new Response(new Uint8Array(bytes), {
    headers: { "content-type": upload.contentType, "content-disposition": `attachment; filename="${dispositionName(upload.originalName)}"`, "x-content-sha256": upload.sha256 },
  });
});
