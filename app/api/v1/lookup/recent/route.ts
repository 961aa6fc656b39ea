import { apiRoute } from "@/lib/platform/http/api-route";
import { listRecentLookups } from "@/lib/api/operations/support";
import { getDb } from "@/db/client";
import { recentLookups } from "@/lib/use-cases/support/lookup";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const GET = apiRoute(listRecentLookups, async ({ actor }) => recentLookups(getDb(), { userId: actor.userId }));
