import { apiRoute } from "@/lib/platform/http/api-route";
import { uploadEvidence as uploadEvidenceOp } from "@/lib/api/operations/builds";
import { auditActor } from "@/lib/platform/auth/actor";
import { uploadEvidence } from "@/lib/use-cases/builds/evidence";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const POST = apiRoute(uploadEvidenceOp, async ({ actor, params, query, req, requestId }) =>
  uploadEvidence({ ...auditActor(actor, requestId), userId: actor.userId }, { buildId: params.id, kind: query.kind, name: query.name, req }),
);
