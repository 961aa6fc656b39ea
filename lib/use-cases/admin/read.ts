import "server-only";
import type { Executor } from "@/db/client";
import { listAuditEvents } from "@/db/audit";
import { describeAuditEvents } from "@/db/audit-subjects";
import { auditRangeBound } from "@/lib/audit/range";
import { listUsers } from "@/db/users";
import { listMailbox } from "@/db/mail";
import { messageBodyText } from "@/lib/mail/raw-message";
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

const MAILBOX_PAGE = 50;

/** One page of the local mailbox (what the app sent, as the stand-in for mail received it), newest first, each body read out of its raw message. */
export async function mailboxPage(db: Executor, { page }: { page: number }) {
  const rows = await listMailbox(db, { limit: MAILBOX_PAGE + 1, offset: (page - 1) * MAILBOX_PAGE });
  return {
    items: rows.slice(0, MAILBOX_PAGE).map((r) => ({ id: r.id, fromAddress: r.fromAddress, toAddresses: r.toAddresses, subject: r.subject, body: messageBodyText(r.raw), receivedAt: r.receivedAt })),
    hasMore: rows.length > MAILBOX_PAGE,
  };
}
