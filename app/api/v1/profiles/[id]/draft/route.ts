import { apiRoute } from "@/lib/platform/http/api-route";
import { saveDraft as saveDraftOp } from "@/lib/api/operations/profiles";
import { getDb } from "@/db/client";
import { auditActor } from "@/lib/platform/auth/actor";
import { saveDraft } from "@/lib/use-cases/profiles/save-draft";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const PUT = apiRoute(saveDraftOp, async ({ actor, params, body, requestId }) =>
  saveDraft(getDb(), { ...auditActor(actor, requestId), userId: actor.userId }, { id: params.id, text: body.text, baseRevision: body.baseRevision }),
);
