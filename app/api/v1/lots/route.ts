import { apiRoute } from "@/lib/platform/http/api-route";
import { createLot as createLotOp, listLots } from "@/lib/api/operations/support";
import { getDb } from "@/db/client";
import { auditActor } from "@/lib/platform/auth/actor";
import { createLot } from "@/lib/use-cases/lots/create";
import { lotsPage } from "@/lib/use-cases/lots/read";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const GET = apiRoute(listLots, async ({ query }) => lotsPage(getDb(), query));

export const POST = apiRoute(createLotOp, async ({ actor, body, requestId }) => createLot(getDb(), auditActor(actor, requestId), body));
