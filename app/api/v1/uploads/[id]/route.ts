import { apiRoute } from "@/lib/platform/http/api-route";
import { downloadUpload } from "@/lib/api/operations/builds";
import { getDb } from "@/db/client";
import { uploadedFile } from "@/lib/use-cases/uploads/download";
import { downloadName } from "@/lib/release/upload-check";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const GET = apiRoute(downloadUpload, async ({ params }) => {
  const { upload, bytes } = await uploadedFile(getDb(), { id: params.id });
  return new Response(new Uint8Array(bytes), {
    headers: { "content-type": upload.contentType, "content-disposition": `attachment; filename="${downloadName(upload.originalName, upload.contentType)}"`, "x-content-sha256": upload.sha256 },
  });
});
