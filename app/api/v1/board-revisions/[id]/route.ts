import { apiRoute } from "@/lib/platform/http/api-route";
import { getBoardRevision, updateBoardRevision } from "@/lib/api/operations/registry";
import { getDb } from "@/db/client";
import * as boards from "@/db/boards";
import { boardRevisionDetail } from "@/lib/use-cases/registry/read";
import { auditActor } from "@/lib/platform/auth/actor";

export const GET = apiRoute(getBoardRevision, async ({ params }) => boardRevisionDetail(getDb(), { id: params.id }));

export const PUT = apiRoute(updateBoardRevision, async ({ actor, params, body, requestId }) => ({
  revision: await boards.updateBoardRevision(getDb(), auditActor(actor, requestId), { id: params.id, ...body }),
}));
