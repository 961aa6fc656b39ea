import { apiRoute } from "@/lib/server/api";
import { listWithdrawnBuilds as withdrawnOp } from "@/lib/api/operations/support";
import { getDb } from "@/db/client";
import { listWithdrawnBuilds } from "@/db/lots";

export const GET = apiRoute(withdrawnOp, async () => ({ items: await listWithdrawnBuilds(getDb()) }));
