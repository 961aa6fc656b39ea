import { apiRoute } from "@/lib/platform/http/api-route";
import { listEveryonesTokens } from "@/lib/api/operations/admin";
import { getDb } from "@/db/client";
import { everyonesTokens } from "@/lib/use-cases/account/tokens";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const GET = apiRoute(listEveryonesTokens, async ({ query }) => everyonesTokens(getDb(), { liveOnly: query.live === "true" }));
