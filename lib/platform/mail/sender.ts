import "server-only";
import nodemailer, { type Transporter } from "nodemailer";
import { getDb, type Database } from "@/db/client";
import { deliverNextDueMail, type DeliveryOutcome } from "@/db/mail";
import { env } from "@/lib/platform/env";
import { logger } from "@/lib/platform/log";

export interface SmtpSettings {
  host: string;
  port: number;
  from: string;
}

/** An SMTP transport with short timeouts: a dead relay must not hold a row lock for long. */
export function smtpTransport(s: SmtpSettings): Transporter {
  return nodemailer.createTransport({ host: s.host, port: s.port, secure: false, ignoreTLS: true, connectionTimeout: 5000, greetingTimeout: 5000, socketTimeout: 10000 });
}

/**
 * Delivers due outbox rows one by one until none is due (or `max` were tried). Safe to run
 * on many instances at once: rows are claimed with FOR UPDATE SKIP LOCKED. Failures are
 * retried later with exponential backoff.
 */
export async function deliverDueMail(opts: { db?: Database; smtp?: SmtpSettings; max?: number } = {}): Promise<Record<DeliveryOutcome, number>> {
  const db = opts.db ?? getDb();
  const smtp = opts.smtp ?? { host: env().SMTP_HOST, port: env().SMTP_PORT, from: env().MAIL_FROM };
  const transport = smtpTransport(smtp);
  const counts: Record<DeliveryOutcome, number> = { sent: 0, retry: 0, failed: 0, none: 0 };
  try {
    for (let i = 0; i < (opts.max ?? 100); i++) {
      const outcome = await deliverNextDueMail(db, async (row) => {
        await transport.sendMail({ from: smtp.from, to: row.toAddresses, subject: row.subject, text: row.bodyText, messageId: `<${row.id}@loopkeeper.invalid>` });
      });
      counts[outcome]++;
      // Nothing due, or the relay is failing: stop here rather than wait out a timeout per row;
      // the failed row is rescheduled with backoff and the next pass starts afresh.
      if (outcome !== "sent") break;
    }
  } finally {
    transport.close();
  }
  return counts;
}

const state = globalThis as unknown as { loopkeeperMailPass?: Promise<void>; loopkeeperMailTimer?: NodeJS.Timeout };

/** Runs one delivery pass in the background unless one is already running in this process. */
export function kickMailSender(): void {
  if (state.loopkeeperMailPass) return;
  state.loopkeeperMailPass = deliverDueMail()
    .then((c) => {
      if (c.sent || c.retry || c.failed) logger.info({ ...c }, "mail delivery pass");
    })
    .catch((err: unknown) => logger.error({ err: err instanceof Error ? err.message : String(err) }, "mail delivery pass failed"))
    .finally(() => {
      state.loopkeeperMailPass = undefined;
    });
}

/** Resolves when this process's background pass (if any) has finished. */
export async function mailSenderIdle(): Promise<void> {
  await state.loopkeeperMailPass;
}

/** Polls the outbox every few seconds; started once per server process from instrumentation. */
export function startMailPolling(intervalMs = 3000): void {
  if (state.loopkeeperMailTimer) return;
  state.loopkeeperMailTimer = setInterval(kickMailSender, intervalMs);
  state.loopkeeperMailTimer.unref();
}
