import { apiRoute } from "@/lib/platform/http/api-route";
import { listRecentLookups as recentOp } from "@/lib/api/operations/support";
import { getDb } from "@/db/client";
import { listRecentLookups } from "@/db/lookup";

export const GET = apiRoute(recentOp, async ({ actor }) => {
  const rows = await listRecentLookups(getDb(), { userId: actor.userId, limit: 10 });
  return { items: rows.map((r) => ({ serial: r.serial, found: r.found, createdAt: r.createdAt.toISOString() })) };
});
