import { apiRoute } from "@/lib/platform/http/api-route";
import { importDraft } from "@/lib/api/operations/profiles";
import { getDb } from "@/db/client";
import { auditActor } from "@/lib/platform/auth/actor";
import { importDraftFile } from "@/lib/use-cases/profiles/save-draft";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const POST = apiRoute(importDraft, async ({ actor, params, req, requestId }) => importDraftFile(getDb(), { ...auditActor(actor, requestId), userId: actor.userId }, { id: params.id, req }));
