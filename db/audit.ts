import "server-only";
import { and, desc, eq, gte, ilike, inArray, lte, or, sql, type SQL } from "drizzle-orm";
import { auditEvents, users } from "./schema";
import type { Executor } from "./client";
import { logger } from "@/lib/platform/log";

export interface AuditActor {
  userId: string | null;
  label: string;
  requestId?: string;
}

type AuditEventInput = { action: string; entityType: string; entityId: string; before?: unknown; after?: unknown };

function auditRow(actor: AuditActor, event: AuditEventInput) {
  return {
    actorUserId: actor.userId,
    actorLabel: actor.label,
    action: event.action,
    entityType: event.entityType,
    entityId: event.entityId,
    before: event.before ?? null,
    after: event.after ?? null,
    requestId: actor.requestId ?? null,
  };
}

/** Writes one audit event; call it inside the transaction that makes the change. */
export async function recordAudit(
  tx: Executor,
  actor: AuditActor,
  event: AuditEventInput,
): Promise<void> {
  await tx.insert(auditEvents).values(auditRow(actor, event));
  logger.info({ requestId: actor.requestId, actor: actor.label, action: event.action, entityType: event.entityType, entityId: event.entityId }, "audit");
}

/**
 * Writes many audit events of one actor in one statement, inside the transaction that makes
 * the changes (a 100,000-lot import); one log line says how many.
 */
export async function recordAuditMany(
  tx: Executor,
  actor: AuditActor,
  events: AuditEventInput[],
): Promise<void> {
  if (events.length === 0) return;
  await tx.insert(auditEvents).values(events.map((event) => auditRow(actor, event)));
  logger.info({ requestId: actor.requestId, actor: actor.label, action: events[0]!.action, entityType: events[0]!.entityType, count: events.length }, "audit");
}

export interface AuditFilter {
  action?: string;
  entityType?: string;
  entityId?: string;
  actor?: string;
  from?: Date;
  to?: Date;
  limit: number;
  offset: number;
}

/** A LIKE pattern that matches `text` literally anywhere (its own %, _ and \\ are escaped). */
function containsPattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

/**
 * Audit events, newest first. Text filters ignore case; "actor" matches the label written with
 * the event (the e-mail then) and the current name and e-mail of the person who acted.
 */
export async function listAuditEvents(db: Executor, f: AuditFilter) {
  const where: SQL[] = [];
  if (f.action) where.push(ilike(auditEvents.action, containsPattern(f.action)));
  if (f.entityType) where.push(sql`lower(${auditEvents.entityType}) = lower(${f.entityType})`);
  if (f.entityId) where.push(eq(auditEvents.entityId, f.entityId));
  if (f.actor) {
    const pattern = containsPattern(f.actor);
    where.push(
      or(
        ilike(auditEvents.actorLabel, pattern),
        inArray(auditEvents.actorUserId, db.select({ id: users.id }).from(users).where(or(ilike(users.name, pattern), ilike(users.email, pattern)))),
      )!,
    );
  }
  if (f.from) where.push(gte(auditEvents.createdAt, f.from));
  if (f.to) where.push(lte(auditEvents.createdAt, f.to));
  return db
    .select()
    .from(auditEvents)
    .where(where.length ? and(...where) : undefined)
    .orderBy(desc(auditEvents.id))
    .limit(f.limit)
    .offset(f.offset);
}
