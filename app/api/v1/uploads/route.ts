import { apiRoute } from "@/lib/server/api";
import { uploadFirmware } from "@/lib/api/operations/builds";
import { auditActor } from "@/lib/server/actor";
import { acceptUpload, requestBody } from "@/lib/server/builds/uploads";

export const POST = apiRoute(uploadFirmware, async ({ actor, query, req, requestId }) => ({
  upload: await acceptUpload({ ...auditActor(actor, requestId), userId: actor.userId }, { kind: "firmware", name: query.name, body: requestBody(req, "firmware") }),
}));
