// Sign-in throttling and the client address, measured against OWASP ASVS 4.0.3 (V2.2.1
// anti-automation: brute force is slowed without locking the owner out) and the sign-in
// error path (V7.4.1: a generic message, never the database's own text).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "drizzle-orm";
import { closeDb, getDb } from "../support/db";
import { authOptions } from "@/lib/platform/auth/options";
import { clientAddress, PEER_HEADER } from "@/lib/platform/http/client-address";
import { resetEnvForTests } from "@/lib/platform/env";
import { ACCOUNT_CAP, ADDRESS_CAP } from "@/lib/auth/throttle";
import { hashPassword } from "@/lib/platform/auth/password";
import { users } from "@/db/schema";
import { recordSignInFailure } from "@/db/throttle";

process.env.LOOPKEEPER_LOG = "silent";

type Authorize = (credentials: Record<string, string>, req: { headers: Record<string, string> }) => Promise<{ id: string } | null>;

/** next-auth's credentials check, exactly as the sign-in endpoint calls it. */
function authorize(): Authorize {
  const provider = authOptions().providers[0] as unknown as { options: { authorize: Authorize } };
  return provider.options.authorize;
}

const PASSWORD = "right-horse-battery-staple";
let email = "";
const stamp = Date.now();

async function signIn(password: string, headers: Record<string, string>): Promise<boolean> {
  return (await authorize()({ email, password }, { headers })) !== null;
}

const from = (peer: string, extra: Record<string, string> = {}) => ({ [PEER_HEADER]: peer, ...extra });

beforeAll(async () => {
  email = `throttle-${Date.now()}@tarnwell.example`;
  await getDb().insert(users).values({ email, name: "Throttle Target", role: "admin", passwordHash: await hashPassword(PASSWORD) });
});

afterAll(async () => {
  await getDb().execute(sql`delete from sign_in_attempts where key like ${`%${email}%`} or key like ${`%xff-${stamp}%`} or key like 'addr:198.51.100.%' or key like 'addr:203.0.113.%'`);
  await closeDb();
});

describe("ASVS 2.2.1 — throttle the attacker, not the owner", () => {
  it("a guessing client waits longer after each failure, while the owner's device still signs in at once", async () => {
    const attacker = from("198.51.100.7");
    for (let i = 0; i < 3; i++) expect(await signIn(`guess-${i}`, attacker)).toBe(false);
    // Further failures recorded directly, so the wait (2^(n-2) s, here 256 s) outlasts a slow test machine.
    for (let i = 3; i < 10; i++) await recordSignInFailure(getDb(), { email, client: "198.51.100.7" });
    // The attacker's pair now waits: even the right password is not heard from that client.
    expect(await signIn(PASSWORD, attacker)).toBe(false);
    // Five failures used to lock the account for everyone for 15 minutes; the owner is unaffected.
    expect(await signIn(PASSWORD, from("203.0.113.20"))).toBe(true);
  });

  it("past the per-account cap, only clients with no recent failure are heard — and the right password still works", async () => {
    // Many clients, each guessing once or twice (a distributed attack): the account passes its cap.
    for (let i = 0; i < ACCOUNT_CAP; i++) await signIn(`spray-${i}`, from(`198.51.100.${100 + i}`));
    const [acct] = (await getDb().execute<{ failures: number }>(sql`select failures from sign_in_attempts where key = ${`acct:${email}`}`)).rows;
    expect(Number(acct?.failures)).toBeGreaterThanOrEqual(ACCOUNT_CAP);
    // A client that already guessed wrong gets no further hearing, even with the right password…
    expect(await signIn(PASSWORD, from("198.51.100.100"))).toBe(false);
    // …the owner's device, with no failures on record, signs in.
    expect(await signIn(PASSWORD, from("203.0.113.21"))).toBe(true);
  });
});

describe("ASVS 2.2.1 — the client address comes from the socket, forwarding headers only from trusted proxies", () => {
  it("changing X-Forwarded-For does not give a direct client a fresh bucket", async () => {
    const peer = "198.51.100.50";
    const target = `xff-${stamp}@tarnwell.example`;
    for (let i = 0; i < 3; i++) await authorize()({ email: target, password: `xff-${i}` }, { headers: from(peer, { "x-forwarded-for": `192.0.2.${i}` }) });
    // Had the header chosen the bucket, each guess would have landed in a fresh one with 1 failure;
    // the socket address collected all three, so the next try from this client waits.
    const [pair] = (await getDb().execute<{ failures: number; locked: boolean }>(sql`select failures, locked_until > now() as locked from sign_in_attempts where key = ${`pair:${target}|${peer}`}`)).rows;
    expect(Number(pair?.failures)).toBe(3);
    expect(pair?.locked).toBe(true);
  });

  it("direct clients do not share one bucket: failures on made-up accounts from one client do not shut out another", async () => {
    const noisy = "198.51.100.60";
    // Most of the failures are recorded directly (each real check costs a bcrypt round); the last
    // few go through the sign-in check itself.
    for (let i = 0; i < ADDRESS_CAP - 5; i++) await recordSignInFailure(getDb(), { email: `nobody-${i}-${stamp}@tarnwell.example`, client: noisy });
    for (let i = 0; i < 5; i++) await authorize()({ email: `nobody-last-${i}-${stamp}@tarnwell.example`, password: "x" }, { headers: from(noisy) });
    // The noisy client is now refused even on a real account with the right password…
    expect(await signIn(PASSWORD, from(noisy))).toBe(false);
    // …while every other direct client is not.
    expect(await signIn(PASSWORD, from("203.0.113.22"))).toBe(true);
  });

  it("reads X-Forwarded-For only when the socket peer is a configured trusted proxy (TRUSTED_PROXIES)", () => {
    const saved = process.env.TRUSTED_PROXIES;
    try {
      process.env.TRUSTED_PROXIES = "10.0.0.0/8, ::1";
      resetEnvForTests();
      // Through the trusted proxy: the right-most address that is not a trusted proxy is the client.
      expect(clientAddress(from("10.0.0.5", { "x-forwarded-for": "192.0.2.66, 10.1.2.3" }))).toBe("192.0.2.66");
      expect(clientAddress(from("::ffff:10.0.0.5", { "x-forwarded-for": "spoofed, 192.0.2.67" }))).toBe("192.0.2.67");
      // From anyone else the header is ignored.
      expect(clientAddress(from("198.51.100.9", { "x-forwarded-for": "192.0.2.66" }))).toBe("198.51.100.9");
      process.env.TRUSTED_PROXIES = "not-an-address";
      resetEnvForTests();
      expect(() => clientAddress(from("10.0.0.5"))).toThrow(/TRUSTED_PROXIES/);
    } finally {
      if (saved === undefined) delete process.env.TRUSTED_PROXIES;
      else process.env.TRUSTED_PROXIES = saved;
      resetEnvForTests();
    }
  });
});

describe("ASVS 7.4.1 — a NUL in the sign-in form gives the generic failure, never database text", () => {
  it("refuses control characters before any query and never throws (a thrown message would land in the redirect URL)", async () => {
    for (const hostile of [`admin\u0000@tarnwell.example`, "admin@tarnwell.example\u202e", "a\u0001b@tarnwell.example"]) {
      await expect(authorize()({ email: hostile, password: "whatever" }, { headers: from("198.51.100.70") })).resolves.toBeNull();
    }
    await expect(authorize()({ email: "admin@tarnwell.example", password: "pass\u0000word" }, { headers: from("198.51.100.70") })).resolves.toBeNull();
  });
});

describe("ASVS 2.2.1 — an admin sees who is slowed down and can unlock an account", () => {
  it("the admin view lists the account with its failures and waits; unlocking forgets them from every client and is audited", async () => {
    const { callRoute, tokenFor } = await import("../support/http");
    const listRoute = await import("@/app/api/v1/admin/sign-in-throttle/route");
    const clearRoute = await import("@/app/api/v1/admin/sign-in-throttle/clear/route");
    const admin = await tokenFor("admin@tarnwell.example");
    const guessing = "198.51.100.201";
    for (let i = 0; i < 6; i++) await recordSignInFailure(getDb(), { email, client: guessing });
    expect(await signIn(PASSWORD, from(guessing))).toBe(false);

    const listed = await callRoute(listRoute.GET, { url: "/api/v1/admin/sign-in-throttle", token: admin });
    expect(listed.status).toBe(200);
    const view = (await listed.json()) as { accounts: { email: string; failures: number; clients: number; longestWaitSec: number }[] };
    const row = view.accounts.find((a) => a.email === email);
    expect(row?.failures).toBeGreaterThanOrEqual(6);
    expect(row?.clients).toBeGreaterThanOrEqual(1);
    expect(row?.longestWaitSec).toBeGreaterThan(0);

    const cleared = await callRoute(clearRoute.POST, { url: "/api/v1/admin/sign-in-throttle/clear", method: "POST", token: admin, body: JSON.stringify({ email: email.toUpperCase() }), headers: { "content-type": "application/json" } });
    expect(cleared.status).toBe(200);
    expect(((await cleared.json()) as { cleared: number }).cleared).toBeGreaterThanOrEqual(2);
    // The client that waited is heard again at once.
    expect(await signIn(PASSWORD, from(guessing))).toBe(true);
    const audit = await getDb().execute<{ n: number }>(sql`select count(*)::int as n from audit_events where action = 'sign_in.unlock' and entity_id = ${email}`);
    expect(audit.rows[0]?.n).toBe(1);
  });
});
