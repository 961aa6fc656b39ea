import { apiRoute } from "@/lib/platform/http/api-route";
import { listRecentLookups } from "@/lib/api/operations/support";
import { getDb } from "@/db/client";
import { recentLookups } from "@/lib/use-cases/support/lookup";

export const GET = apiRoute(listRecentLookups, async ({ actor }) => recentLookups(getDb(), { userId: actor.userId }));
