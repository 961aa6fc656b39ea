import { apiRoute } from "@/lib/platform/http/api-route";
import { uploadEvidence } from "@/lib/api/operations/builds";
import { attachEvidence } from "@/db/build-stages";
import { getBuild } from "@/db/builds";
import { getDb } from "@/db/client";
import { AppError } from "@/lib/api/errors";
import { auditActor } from "@/lib/platform/auth/actor";
import { acceptUpload, requestBody } from "@/lib/use-cases/builds/uploads";

export const POST = apiRoute(uploadEvidence, async ({ actor, params, query, req, requestId }) => {
  // 404 before reading a byte of the upload.
  if (!(await getBuild(getDb(), { id: params.id }))) throw new AppError("not_found", "No build with that id.");
  const who = { ...auditActor(actor, requestId), userId: actor.userId };
  const upload = await acceptUpload(who, {
    kind: query.kind,
    name: query.name,
    body: requestBody(req, query.kind),
    attach: (tx, row) => attachEvidence(tx, who, { buildId: params.id, kind: query.kind, uploadId: row.id }),
  });
  return { upload };
});
