import { apiRoute } from "@/lib/platform/http/api-route";
import { listAudit } from "@/lib/api/operations/admin";
import { getDb } from "@/db/client";
import { listAuditEvents } from "@/db/audit";
import { describeAuditEvents } from "@/db/audit-subjects";
import { auditRangeBound } from "@/lib/audit/range";

export const GET = apiRoute(listAudit, async ({ query }) => {
  const db = getDb();
  const rows = await listAuditEvents(db, {
    action: query.action,
    entityType: query.entityType,
    entityId: query.entityId,
    actor: query.actor,
    from: auditRangeBound(query.from, "from"),
    to: auditRangeBound(query.to, "to"),
    limit: query.pageSize + 1,
    offset: (query.page - 1) * query.pageSize,
  });
  const items = await describeAuditEvents(db, rows.slice(0, query.pageSize));
  return { items, page: query.page, pageSize: query.pageSize, hasMore: rows.length > query.pageSize };
});
