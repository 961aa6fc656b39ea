import { apiRoute } from "@/lib/platform/http/api-route";
import { importDraft } from "@/lib/api/operations/profiles";
import { getDb } from "@/db/client";
import { auditActor } from "@/lib/platform/auth/actor";
import { importDraftFile } from "@/lib/use-cases/profiles/save-draft";

export const POST = apiRoute(importDraft, async ({ actor, params, req, requestId }) => importDraftFile(getDb(), { ...auditActor(actor, requestId), userId: actor.userId }, { id: params.id, req }));
