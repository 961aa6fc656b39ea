import { apiRoute } from "@/lib/platform/http/api-route";
import { listWithdrawnBuilds as withdrawnOp } from "@/lib/api/operations/support";
import { getDb } from "@/db/client";
import { listWithdrawnBuilds } from "@/db/lots";

export const GET = apiRoute(withdrawnOp, async () => ({ items: await listWithdrawnBuilds(getDb()) }));
