import "server-only";
import { and, desc, eq, gte, ilike, lte, or, type SQL } from "drizzle-orm";
import { auditEvents } from "./schema";
import type { Executor } from "./client";
import { logger } from "@/lib/platform/log";

export interface AuditActor {
  userId: string | null;
  label: string;
  requestId?: string;
}

/** Writes one audit event; call it inside the transaction that makes the change. */
export async function recordAudit(
  tx: Executor,
  actor: AuditActor,
  event: { action: string; entityType: string; entityId: string; before?: unknown; after?: unknown },
): Promise<void> {
  await tx.insert(auditEvents).values({
    actorUserId: actor.userId,
    actorLabel: actor.label,
    action: event.action,
    entityType: event.entityType,
    entityId: event.entityId,
    before: event.before ?? null,
    after: event.after ?? null,
    requestId: actor.requestId ?? null,
  });
  logger.info({ requestId: actor.requestId, actor: actor.label, action: event.action, entityType: event.entityType, entityId: event.entityId }, "audit");
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

export async function listAuditEvents(db: Executor, f: AuditFilter) {
  const where: SQL[] = [];
  if (f.action) where.push(ilike(auditEvents.action, `%${f.action}%`));
  if (f.entityType) where.push(eq(auditEvents.entityType, f.entityType));
  if (f.entityId) where.push(eq(auditEvents.entityId, f.entityId));
  if (f.actor) where.push(or(ilike(auditEvents.actorLabel, `%${f.actor}%`))!);
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
