import { apiRoute } from "@/lib/platform/http/api-route";
import { saveDraft } from "@/lib/api/operations/profiles";
import { getDb } from "@/db/client";
import * as profiles from "@/db/profiles";
import { auditActor } from "@/lib/platform/auth/actor";

export const PUT = apiRoute(saveDraft, async ({ actor, params, body, requestId }) =>
  profiles.saveDraft(getDb(), { ...auditActor(actor, requestId), userId: actor.userId }, { id: params.id, text: body.text, baseRevision: body.baseRevision }),
);
