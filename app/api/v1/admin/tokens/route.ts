import { apiRoute } from "@/lib/platform/http/api-route";
import { listEveryonesTokens } from "@/lib/api/operations/admin";
import { getDb } from "@/db/client";
import { listAllTokens } from "@/db/tokens";

export const GET = apiRoute(listEveryonesTokens, async ({ query }) => ({ items: await listAllTokens(getDb(), { liveOnly: query.live === "true" }) }));
