import { apiRoute } from "@/lib/platform/http/api-route";
import { getLotOptions } from "@/lib/api/operations/support";
import { getDb } from "@/db/client";
import { lotOptions } from "@/db/lots";

export const GET = apiRoute(getLotOptions, async () => ({ boardModels: await lotOptions(getDb()) }));
