import { apiRoute } from "@/lib/platform/http/api-route";
import { uploadFirmware } from "@/lib/api/operations/builds";
import { auditActor } from "@/lib/platform/auth/actor";
import { acceptUpload, requestBody } from "@/lib/use-cases/builds/uploads";

export const POST = apiRoute(uploadFirmware, async ({ actor, query, req, requestId }) => ({
  upload: await acceptUpload({ ...auditActor(actor, requestId), userId: actor.userId }, { kind: "firmware", name: query.name, body: requestBody(req, "firmware") }),
}));
