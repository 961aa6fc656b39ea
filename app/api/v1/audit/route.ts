import { apiRoute } from "@/lib/platform/http/api-route";
import { listAudit } from "@/lib/api/operations/admin";
import { getDb } from "@/db/client";
import { listAuditEvents } from "@/db/audit";

export const GET = apiRoute(listAudit, async ({ query }) => {
  const rows = await listAuditEvents(getDb(), {
    action: query.action,
    entityType: query.entityType,
    entityId: query.entityId,
    actor: query.actor,
    from: query.from ? new Date(query.from) : undefined,
    to: query.to ? new Date(query.to) : undefined,
    limit: query.pageSize + 1,
    offset: (query.page - 1) * query.pageSize,
  });
  return { items: rows.slice(0, query.pageSize), page: query.page, pageSize: query.pageSize, hasMore: rows.length > query.pageSize };
});
