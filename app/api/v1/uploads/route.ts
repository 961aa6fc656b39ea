import { apiRoute } from "@/lib/platform/http/api-route";
import { uploadFirmware } from "@/lib/api/operations/builds";
import { auditActor } from "@/lib/platform/auth/actor";
import { acceptUpload, requestBody } from "@/lib/use-cases/builds/uploads";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const POST = apiRoute(uploadFirmware, async ({ actor, query, req, requestId }) => ({
  upload: await acceptUpload({ ...auditActor(actor, requestId), userId: actor.userId }, { kind: "firmware", name: query.name, body: requestBody(req, "firmware") }),
}));
