import "server-only";
import { sql } from "drizzle-orm";
import type { Executor } from "./client";
import { ADDRESS_CAP, FREE_FAILURES, MAX_DELAY_SEC, WINDOW_MINUTES, type ThrottleState } from "@/lib/auth/throttle";

export { WINDOW_MINUTES };

/** Key of one account (e-mail, case-folded) from one client address. */
function pairKey(email: string, client: string): string {
  return `pair:${email.toLowerCase()}|${client}`;
}
function accountKey(email: string): string {
  return `acct:${email.toLowerCase()}`;
}
function addressKey(client: string): string {
  return `addr:${client}`;
}

const windowStart = sql`now() - make_interval(mins => ${WINDOW_MINUTES})`;

/** The counts that decide whether this client may try this account now; expired windows count as 0. */
export async function readThrottle(db: Executor, { email, client }: { email: string; client: string }): Promise<ThrottleState> {
  const keys = [pairKey(email, client), accountKey(email), addressKey(client)];
  const res = await db.execute<{ key: string; failures: number; wait: number; window_left: number }>(sql`
    select key, failures,
      greatest(0, ceil(extract(epoch from (locked_until - now()))))::int as wait,
      greatest(0, ceil(extract(epoch from (window_started_at + make_interval(mins => ${WINDOW_MINUTES}) - now()))))::int as window_left
    from sign_in_attempts
    where key in (${sql.join(keys.map((k) => sql`${k}`), sql`, `)}) and window_started_at >= ${windowStart}`);
  const row = (k: string) => res.rows.find((r) => r.key === k);
  const pair = row(keys[0]!);
  const account = row(keys[1]!);
  const address = row(keys[2]!);
  return {
    pairFailures: Number(pair?.failures ?? 0),
    pairWaitSec: Number(pair?.wait ?? 0),
    accountFailures: Number(account?.failures ?? 0),
    addressFailures: Number(address?.failures ?? 0),
    addressWaitSec: Number(address?.window_left ?? 0),
  };
}

/** Counts one failure in the key's window (a new window when the old one ended); returns the count. */
async function countFailure(db: Executor, key: string): Promise<number> {
  const res = await db.execute<{ failures: number }>(sql`
    insert into sign_in_attempts (key, failures, window_started_at, updated_at)
    values (${key}, 1, now(), now())
    on conflict (key) do update set
      failures = case when sign_in_attempts.window_started_at < ${windowStart} then 1 else sign_in_attempts.failures + 1 end,
      window_started_at = case when sign_in_attempts.window_started_at < ${windowStart} then now() else sign_in_attempts.window_started_at end,
      locked_until = case when sign_in_attempts.window_started_at < ${windowStart} then null else sign_in_attempts.locked_until end,
      updated_at = now()
    returning failures`);
  return Number(res.rows[0]?.failures ?? 1);
}

/**
 * One wrong password (or unknown account) from this client: the pair's wait doubles past the
 * free failures, the account and the address count one more.
 */
export async function recordSignInFailure(db: Executor, { email, client }: { email: string; client: string }): Promise<void> {
  const pair = pairKey(email, client);
  const pairFailures = await countFailure(db, pair);
  if (pairFailures > FREE_FAILURES) {
    await db.execute(sql`
      update sign_in_attempts
      set locked_until = now() + make_interval(secs => least(${MAX_DELAY_SEC}, power(2, ${pairFailures - FREE_FAILURES})))
      where key = ${pair}`);
  }
  await countFailure(db, accountKey(email));
  const addressFailures = await countFailure(db, addressKey(client));
  if (addressFailures >= ADDRESS_CAP) {
    await db.execute(sql`update sign_in_attempts set locked_until = window_started_at + make_interval(mins => ${WINDOW_MINUTES}) where key = ${addressKey(client)}`);
  }
}

/** The right password from this client: its own record on the account is cleared. */
export async function recordSignInSuccess(db: Executor, { email, client }: { email: string; client: string }): Promise<void> {
  await db.execute(sql`delete from sign_in_attempts where key = ${pairKey(email, client)}`);
}

export interface ThrottledAccount {
  email: string;
  failures: number;
  /** Client addresses with failures on this account in the window, and how long each still waits. */
  clients: { client: string; failures: number; waitSec: number }[];
  lastFailureAt: Date;
}

/** Accounts with failed sign-ins in the current window, most failures first (the admin view). */
export async function listThrottledAccounts(db: Executor): Promise<ThrottledAccount[]> {
  const res = await db.execute<{ key: string; failures: number; wait: number; updated_at: string | Date }>(sql`
    select key, failures, greatest(0, ceil(extract(epoch from (locked_until - now()))))::int as wait, updated_at
    from sign_in_attempts
    where (starts_with(key, 'acct:') or starts_with(key, 'pair:')) and window_started_at >= ${windowStart}
    order by key`);
  const accounts = new Map<string, ThrottledAccount>();
  for (const r of res.rows) {
    if (!r.key.startsWith("acct:")) continue;
    accounts.set(r.key.slice(5), { email: r.key.slice(5), failures: Number(r.failures), clients: [], lastFailureAt: new Date(r.updated_at) });
  }
  for (const r of res.rows) {
    if (!r.key.startsWith("pair:")) continue;
    const rest = r.key.slice(5);
    const bar = rest.lastIndexOf("|");
    const account = accounts.get(rest.slice(0, bar));
    account?.clients.push({ client: rest.slice(bar + 1), failures: Number(r.failures), waitSec: Number(r.wait) });
  }
  return [...accounts.values()].sort((a, b) => b.failures - a.failures || a.email.localeCompare(b.email));
}

/** Clears every failure recorded against this account, from every client (admin unlock). */
export async function unlockAccount(db: Executor, { email }: { email: string }): Promise<number> {
  const e = email.toLowerCase();
  const res = await db.execute(sql`delete from sign_in_attempts where key = ${accountKey(e)} or starts_with(key, ${`pair:${e}|`})`);
  return res.rowCount ?? 0;
}

export interface ThrottledAccountRow {
  email: string;
  failures: number;
  windowEndsAt: Date;
  clients: number;
  longestWaitSec: number;
}

/** Accounts and addresses with failures in the current window (the admin's view), most failures first. */
export async function listThrottled(db: Executor): Promise<{ accounts: ThrottledAccountRow[]; addresses: { address: string; failures: number; waitSec: number }[] }> {
  const accounts = await db.execute<{ email: string; failures: number; window_ends_at: Date | string; clients: number; longest_wait: number }>(sql`
    select substr(a.key, 6) as email, a.failures,
      a.window_started_at + make_interval(mins => ${WINDOW_MINUTES}) as window_ends_at,
      (select count(*) from sign_in_attempts p where p.key like 'pair:%' and split_part(substr(p.key, 6), '|', 1) = substr(a.key, 6) and p.window_started_at >= ${windowStart})::int as clients,
      coalesce((select max(greatest(0, ceil(extract(epoch from (p.locked_until - now()))))) from sign_in_attempts p
        where p.key like 'pair:%' and split_part(substr(p.key, 6), '|', 1) = substr(a.key, 6) and p.window_started_at >= ${windowStart}), 0)::int as longest_wait
    from sign_in_attempts a
    where a.key like 'acct:%' and a.window_started_at >= ${windowStart}
    order by a.failures desc, a.key
    limit 200`);
  const addresses = await db.execute<{ address: string; failures: number; wait: number }>(sql`
    select substr(key, 6) as address, failures, greatest(0, ceil(extract(epoch from (locked_until - now()))))::int as wait
    from sign_in_attempts
    where key like 'addr:%' and window_started_at >= ${windowStart}
    order by failures desc, key
    limit 200`);
  return {
    accounts: accounts.rows.map((r) => ({ email: r.email, failures: Number(r.failures), windowEndsAt: new Date(r.window_ends_at), clients: Number(r.clients), longestWaitSec: Number(r.longest_wait) })),
    addresses: addresses.rows.map((r) => ({ address: r.address, failures: Number(r.failures), waitSec: Number(r.wait ?? 0) })),
  };
}

/** Forgets an account's failures from every client (an admin unlocking it); returns how many records went. */
export async function clearAccountThrottle(tx: Executor, { email }: { email: string }): Promise<number> {
  const e = email.toLowerCase();
  const res = await tx.execute<{ key: string }>(sql`
    delete from sign_in_attempts
    where key = ${accountKey(e)} or (key like 'pair:%' and split_part(substr(key, 6), '|', 1) = ${e})
    returning key`);
  return res.rows.length;
}
