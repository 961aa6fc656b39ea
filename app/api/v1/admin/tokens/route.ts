import { apiRoute } from "@/lib/platform/http/api-route";
import { listEveryonesTokens } from "@/lib/api/operations/admin";
import { getDb } from "@/db/client";
import { everyonesTokens } from "@/lib/use-cases/account/tokens";

export const GET = apiRoute(listEveryonesTokens, async ({ query }) => everyonesTokens(getDb(), { liveOnly: query.live === "true" }));
