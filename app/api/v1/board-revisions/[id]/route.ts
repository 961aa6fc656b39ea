import { apiRoute } from "@/lib/platform/http/api-route";
import { getBoardRevision, updateBoardRevision as updateBoardRevisionOp } from "@/lib/api/operations/registry";
import { getDb } from "@/db/client";
import { auditActor } from "@/lib/platform/auth/actor";
import { boardRevisionDetail } from "@/lib/use-cases/registry/read";
import { updateBoardRevision } from "@/lib/use-cases/registry/save-board-revision";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const GET = apiRoute(getBoardRevision, async ({ params }) => boardRevisionDetail(getDb(), { id: params.id }));

export const PUT = apiRoute(updateBoardRevisionOp, async ({ actor, params, body, requestId }) => ({ revision: await updateBoardRevision(getDb(), auditActor(actor, requestId), { id: params.id, ...body }) }));
