import "server-only";
import { and, asc, desc, eq, inArray, lte, sql } from "drizzle-orm";
import { localMailbox, mailOutbox, users, type MailOutboxRow, type Role } from "./schema";
import type { Database, Executor } from "./client";
import type { OutgoingMail } from "@/lib/release/mail";

/** After this many failed attempts a message stops being retried and shows as failed. */
export const MAX_MAIL_ATTEMPTS = 8;

/** Queues messages in the caller's transaction: they exist exactly when the change commits. */
export async function enqueueMail(tx: Executor, mails: readonly OutgoingMail[]): Promise<void> {
  if (mails.length === 0) return;
  await tx.insert(mailOutbox).values(mails.map((m) => ({ toAddresses: m.to, subject: m.subject, bodyText: m.bodyText })));
}

/** Addresses of active users with one of `roles`, leaving out `exceptUserIds`. */
export async function emailsByRole(db: Executor, { roles, exceptUserIds = [] }: { roles: Role[]; exceptUserIds?: string[] }): Promise<string[]> {
  const rows = await db.select({ id: users.id, email: users.email, disabledAt: users.disabledAt }).from(users).where(inArray(users.role, roles));
  return rows.filter((u) => !u.disabledAt && !exceptUserIds.includes(u.id)).map((u) => u.email);
}

/** Retry delay after `attempts` failures: 5 s doubling, at most an hour. */
export function backoffSeconds(attempts: number): number {
  return Math.min(3600, 5 * 2 ** Math.max(0, attempts - 1));
}

export type DeliveryOutcome = "sent" | "retry" | "failed" | "none";

/**
 * Claims one due message and hands it to `send` while holding its row lock (SKIP LOCKED,
 * so concurrent senders on any instance take different rows), then marks it sent — or
 * schedules a retry with exponential backoff — in the same transaction. A row is marked
 * sent once: the status change and the lock make a second claim impossible.
 */
export async function deliverNextDueMail(db: Database, send: (row: MailOutboxRow) => Promise<void>): Promise<DeliveryOutcome> {
  return db.transaction(async (tx) => {
    const [row] = await tx
      .select()
      .from(mailOutbox)
      .where(and(eq(mailOutbox.status, "pending"), lte(mailOutbox.nextAttemptAt, sql`now()`)))
      .orderBy(asc(mailOutbox.nextAttemptAt))
      .limit(1)
      .for("update", { skipLocked: true });
    if (!row) return "none";
    try {
      await send(row);
    } catch (err) {
      const attempts = row.attempts + 1;
      const failed = attempts >= MAX_MAIL_ATTEMPTS;
      await tx
        .update(mailOutbox)
        .set({
          attempts,
          status: failed ? "failed" : "pending",
          lastError: (err instanceof Error ? err.message : String(err)).slice(0, 500),
          nextAttemptAt: sql`now() + make_interval(secs => ${backoffSeconds(attempts)})`,
        })
        .where(eq(mailOutbox.id, row.id));
      return failed ? "failed" : "retry";
    }
    await tx.update(mailOutbox).set({ status: "sent", sentAt: sql`now()`, attempts: row.attempts + 1, lastError: null }).where(and(eq(mailOutbox.id, row.id), eq(mailOutbox.status, "pending")));
    return "sent";
  });
}

export async function listMailbox(db: Executor, { limit, offset }: { limit: number; offset: number }) {
  return db.select().from(localMailbox).orderBy(desc(localMailbox.id)).limit(limit).offset(offset);
}

export async function listOutbox(db: Executor, { limit }: { limit: number }) {
  return db.select().from(mailOutbox).orderBy(desc(mailOutbox.createdAt)).limit(limit);
}
