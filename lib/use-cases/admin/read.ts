import "server-only";
import type { Executor } from "@/db/client";
import { listAuditEvents } from "@/db/audit";
import { describeAuditEvents } from "@/db/audit-subjects";
import { auditRangeBound } from "@/lib/audit/range";
import { listUsers } from "@/db/users";
import type { AuditQuery } from "@/lib/api/operations/admin";

/** One page of audit events, newest first; one row more is read to know whether older ones follow. Read by the API and the audit page. */
export async function auditPage(db: Executor, query: AuditQuery) {
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
  // Each event with its sentence and the thing it changed, named with its version and linked.
  const items = await describeAuditEvents(db, rows.slice(0, query.pageSize));
  return { items, page: query.page, pageSize: query.pageSize, hasMore: rows.length > query.pageSize };
}

/** Every account with its role and state (no password hashes). */
export async function usersList(db: Executor) {
  return { items: await listUsers(db) };
}
