import { afterAll, describe, expect, it } from "vitest";
import type { AddressInfo } from "node:net";
import { SMTPServer } from "smtp-server";
import { eq, sql } from "drizzle-orm";
import { closeDb, getDb } from "./support/db";
import { freshDraftBuild, mover } from "./support/builds";
import { builds, mailOutbox } from "@/db/schema";
import { moveBuild } from "@/lib/use-cases/builds/stages";
import { deliverDueMail, mailSenderIdle } from "@/lib/platform/mail/sender";

// Background passes started by the transition itself go nowhere.
process.env.SMTP_PORT = "1";

afterAll(closeDb);

/** An SMTP server on loopback that remembers the subjects it accepted. */
async function startSmtp(port = 0) {
  const subjects: string[] = [];
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS", "AUTH"],
    logger: false,
    onData(stream, _session, cb) {
      let raw = "";
      stream.on("data", (c: Buffer) => (raw += c.toString("utf8")));
      stream.on("end", () => {
        // Unfold long header lines (RFC 5322 §2.2.3) before reading the subject.
        const head = raw.split(/\r?\n\r?\n/, 1)[0]!.replace(/\r?\n([ \t])/g, "$1");
        subjects.push(/^subject:\s*(.*)$/im.exec(head)?.[1]?.trim() ?? "");
        cb();
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, "127.0.0.1", () => resolve());
  });
  const actual = (server.server.address() as AddressInfo).port;
  return { port: actual, subjects, stop: () => new Promise<void>((r) => server.close(() => r())) };
}

describe("outgoing mail", () => {
  it("commits a promotion while SMTP is down and delivers its mail once when SMTP is back", async () => {
    const first = await startSmtp();
    const port = first.port;
    await first.stop(); // SMTP is now down on a port we know.

    const engineer = await mover("engineer@tarnwell.example");
    const b = await freshDraftBuild();
    await moveBuild(engineer, { id: b.id, from: "draft", to: "review" });
    // The pass the transition kicked off (to a dead port) must not race the checks below.
    await mailSenderIdle();
    const db = getDb();
    const [row] = await db.select().from(builds).where(eq(builds.id, b.id));
    expect(row!.stage).toBe("review");

    const subject = `[Loopkeeper] Build TC-1 cooler controller ${row!.version} is waiting for your review`;
    const smtp = { host: "127.0.0.1", port, from: "Loopkeeper <loopkeeper@loopkeeper.invalid>" };
    // Each pass stops at its first failure, so older due rows from other tests may come first.
    let [mail] = await db.select().from(mailOutbox).where(eq(mailOutbox.subject, subject));
    for (let i = 0; i < 500 && mail!.attempts === 0; i++) {
      await deliverDueMail({ smtp });
      [mail] = await db.select().from(mailOutbox).where(eq(mailOutbox.subject, subject));
    }
    expect(mail!.status).toBe("pending");
    expect(mail!.attempts).toBeGreaterThanOrEqual(1);
    expect(mail!.lastError).toBeTruthy();
    expect(mail!.nextAttemptAt.getTime()).toBeGreaterThan(Date.now());
    // Eligible reviewers: every active engineer and admin but the author (other suites may add accounts).
    expect(mail!.toAddresses).toEqual(expect.arrayContaining(["admin@tarnwell.example", "engineer2@tarnwell.example", "engineer3@tarnwell.example"]));
    expect(mail!.toAddresses).not.toContain("engineer@tarnwell.example");
    expect(mail!.toAddresses).not.toContain("viewer@tarnwell.example");

    const back = await startSmtp(port);
    try {
      // Time passes: the backoff is over.
      await db.update(mailOutbox).set({ nextAttemptAt: sql`now()` }).where(eq(mailOutbox.id, mail!.id));
      // Three senders at once, as three app instances would run them.
      await Promise.all([deliverDueMail({ smtp }), deliverDueMail({ smtp }), deliverDueMail({ smtp })]);
      await deliverDueMail({ smtp });
      expect(back.subjects.filter((s) => s === subject)).toHaveLength(1);
      [mail] = await db.select().from(mailOutbox).where(eq(mailOutbox.id, mail!.id));
      expect(mail!.status).toBe("sent");
      expect(mail!.sentAt).not.toBeNull();
    } finally {
      await back.stop();
    }
  });
});
