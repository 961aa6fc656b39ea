import { spawn, type ChildProcess } from "node:child_process";
import { randomUUID } from "node:crypto";
import { request as playwrightRequest, expect, test, type APIRequestContext } from "@playwright/test";
import { Client } from "pg";
import { ACCOUNTS, signInRequest } from "./support/accounts";

// Two more app instances from the same build, on their own ports, against the same
// PostgreSQL as the main test server: whatever one instance counts, locks, sends or signs
// in, the other must honour. The budget is small enough to spend in a test.
const base = Number(process.env.E2E_PORT || 3100) + 60;
const ports = [base, base + 1] as const;
const RATE_LIMIT_PER_MIN = 200;
// lib/rate-limit/request-budget.ts: each instance admits fewer than batchSize requests the
// others cannot see yet; batchSize is 1 % of the limit (2 here), so two instances may go
// past the limit by at most 2 × (2 − 1).
const TOLERANCE = ports.length * (Math.max(1, Math.floor(RATE_LIMIT_PER_MIN / 100)) - 1);
const PASSWORD = "scale-out-password-1";

const url = (i: 0 | 1, path: string) => `http://127.0.0.1:${ports[i]}${path}`;
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function waitForLive(port: number): Promise<void> {
  for (let i = 0; i < 240; i++) {
    try {
      if ((await fetch(`http://127.0.0.1:${port}/api/health`)).status === 200) return;
    } catch {
      /* not listening yet */
    }
    await sleep(500);
  }
  throw new Error(`instance on ${port} did not come up`);
}

async function signIn(ctx: APIRequestContext, i: 0 | 1, email: string, password: string): Promise<number> {
  const csrf = (await (await ctx.get(url(i, "/api/auth/csrf"))).json()) as { csrfToken: string };
  await ctx.post(url(i, "/api/auth/callback/credentials"), { form: { csrfToken: csrf.csrfToken, email, password, json: "true" }, maxRedirects: 0 });
  return (await ctx.get(url(i, "/api/v1/me"))).status();
}

test.describe.configure({ mode: "serial" });

test("two instances share sessions, token revocation, one rate budget, sign-in throttling and send each mail once", async ({ request }) => {
  test.setTimeout(300_000);
  const instances: ChildProcess[] = ports.map((port) =>
    spawn(process.execPath, ["scripts/serve.mjs"], {
      env: { ...process.env, PORT: String(port), HOST: "127.0.0.1", NODE_ENV: "production", API_RATE_LIMIT_PER_MIN: String(RATE_LIMIT_PER_MIN), LOOPKEEPER_REQUEST_STATS: "" },
      stdio: "ignore",
    }),
  );
  const contexts: APIRequestContext[] = [];
  const db = new Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  try {
    await Promise.all(ports.map(waitForLive));
    const fresh = async () => {
      const ctx = await playwrightRequest.newContext();
      contexts.push(ctx);
      return ctx;
    };

    // A person of their own for this test, so the budget and the lock touch nobody else.
    await signInRequest(request, ACCOUNTS.admin);
    const stamp = randomUUID().slice(0, 8);
    const newUser = async (tag: string) => {
      const email = `scale-${tag}-${stamp}@tarnwell.example`;
      const res = await request.post("/api/v1/users", { data: { email, name: `Scale ${tag}`, role: "viewer", password: PASSWORD } });
      expect(res.status()).toBe(201);
      return email;
    };

    // Sessions: signed in on one instance, recognised on the other.
    const budgetEmail = await newUser("budget");
    const person = await fresh();
    expect(await signIn(person, 0, budgetEmail, PASSWORD)).toBe(200);
    expect(await (await person.get(url(1, "/api/v1/me"))).json()).toMatchObject({ email: budgetEmail, via: "session" });

    // A token made on one instance works on the other; revoked there, refused everywhere.
    const created = (await (await person.post(url(0, "/api/v1/tokens"), { data: { name: "scale-out", expiresInDays: 1 } })).json()) as { token: { id: string }; secret: string };
    const bearer = { authorization: `Bearer ${created.secret}` };
    const machine = await fresh();
    expect((await machine.get(url(1, "/api/v1/me"), { headers: bearer })).status()).toBe(200);
    expect((await machine.get(url(0, "/api/v1/me"), { headers: bearer })).status()).toBe(200);
    expect((await person.delete(url(1, `/api/v1/tokens/${created.token.id}`))).status()).toBe(200);
    // The other instance hears of it through PostgreSQL (its cache holds entries 10 s; these tries take far less).
    let afterRevoke = 0;
    for (let i = 0; i < 50 && afterRevoke !== 401; i++) {
      afterRevoke = (await machine.get(url(0, "/api/v1/me"), { headers: bearer })).status();
      if (afterRevoke !== 401) await sleep(20);
    }
    expect(afterRevoke).toBe(401);

    // One budget per person across instances, sessions and tokens.
    const second = (await (await person.post(url(1, "/api/v1/tokens"), { data: { name: "scale-out 2", expiresInDays: 1 } })).json()) as { secret: string };
    // Start the burst early in a minute, so it stays within one window.
    const intoMinuteMs = Date.now() % 60_000;
    if (intoMinuteMs > 30_000) await sleep(60_000 - intoMinuteMs + 200);
    const windowAtStart = Math.floor(Date.now() / 60_000);
    const statuses: number[] = [];
    const total = RATE_LIMIT_PER_MIN + 40;
    for (let n = 0; n < total; n += 10) {
      const batch = Array.from({ length: 10 }, (_, k) => {
        const i = ((n + k) % 2) as 0 | 1;
        // Alternate instances, and session / token callers.
        return (n + k) % 3 === 0 ? person.get(url(i, "/api/v1/me")) : machine.get(url(i, "/api/v1/me"), { headers: { authorization: `Bearer ${second.secret}` } });
      });
      statuses.push(...(await Promise.all(batch)).map((r) => r.status()));
    }
    expect(Math.floor(Date.now() / 60_000), "the burst ran within one rate-limit window").toBe(windowAtStart);
    const admitted = statuses.filter((s) => s === 200).length;
    expect(statuses.filter((s) => s !== 200 && s !== 429)).toEqual([]);
    // The calls above (sign-in check, tokens, revocation) may have spent up to 7 of this window.
    expect(admitted).toBeGreaterThanOrEqual(RATE_LIMIT_PER_MIN - 7);
    expect(admitted).toBeLessThanOrEqual(RATE_LIMIT_PER_MIN + TOLERANCE);

    // Sign-in throttling: failures on either instance count together.
    const lockedEmail = await newUser("throttle");
    const guesser = await fresh();
    for (let k = 0; k < 5; k++) expect(await signIn(guesser, (k % 2) as 0 | 1, lockedEmail, "wrong-password-123")).toBe(401);
    expect(await signIn(guesser, 0, lockedEmail, PASSWORD)).toBe(401);
    expect(await signIn(await fresh(), 1, lockedEmail, PASSWORD)).toBe(401);

    // Mail: every instance polls the outbox; each message reaches the mailbox once.
    const subjects = Array.from({ length: 12 }, (_, k) => `scale-out ${stamp} #${k}`);
    for (const subject of subjects) {
      await db.query(`insert into mail_outbox (to_addresses, subject, body_text) values ($1, $2, 'Sent by the scale-out test.')`, [["viewer@tarnwell.example"], subject]);
    }
    let unsent = subjects.length;
    for (let i = 0; i < 120 && unsent > 0; i++) {
      await sleep(500);
      unsent = Number((await db.query(`select count(*)::int as n from mail_outbox where subject like $1 and sent_at is null`, [`scale-out ${stamp} #%`])).rows[0].n);
    }
    expect(unsent).toBe(0);
    const delivered = await db.query(`select subject, count(*)::int as n from local_mailbox where subject like $1 group by subject order by subject`, [`scale-out ${stamp} #%`]);
    expect(delivered.rows.map((r: { subject: string; n: number }) => [r.subject, r.n])).toEqual(subjects.slice().sort().map((s) => [s, 1]));
  } finally {
    for (const ctx of contexts) await ctx.dispose();
    await db.end();
    for (const instance of instances) instance.kill("SIGTERM");
  }
});
