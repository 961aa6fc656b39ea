import "server-only";
import { listenActorChanges } from "@/db/actor-changes";
import { beforeCloseDb } from "@/db/client";
import type { Role } from "@/lib/auth/roles";

/** How long a token's or user's access may be reused without asking PostgreSQL again. */
export const ACTOR_CACHE_TTL_MS = 10_000;
const MAX_ENTRIES = 10_000;

interface Entry<V> {
  value: V;
  userId: string;
  expiresAtMs: number;
}

/**
 * A few seconds of memory of who a token or a session's user is, so the API's hot path does
 * not ask PostgreSQL on every request. Entries go as soon as PostgreSQL announces a change
 * to that user's access (triggers on users and api_tokens, LISTEN on a dedicated connection);
 * while that connection is down nothing is cached, so no change can be missed. The TTL only
 * bounds memory and clock-driven changes such as a token's expiry time.
 */
export class ActorCache<V> {
  private readonly entries = new Map<string, Entry<V>>();
  /** Bumped on every invalidation: a value read from the database before a change is not stored after it. */
  private generation = 0;
  listening = false;

  constructor(private readonly now: () => number = Date.now) {}

  get(key: string): V | undefined {
    const e = this.entries.get(key);
    if (!e) return undefined;
    if (!this.listening || e.expiresAtMs <= this.now()) {
      this.entries.delete(key);
      return undefined;
    }
    return e.value;
  }

  /** The generation to pass to `set` for a value about to be read from the database. */
  mark(): number {
    return this.generation;
  }

  set(key: string, value: V, { userId, generation, notAfterMs }: { userId: string; generation: number; notAfterMs?: number }): void {
    if (!this.listening || generation !== this.generation) return;
    if (this.entries.size >= MAX_ENTRIES) this.entries.clear();
    const expiresAtMs = Math.min(this.now() + ACTOR_CACHE_TTL_MS, notAfterMs ?? Infinity);
    this.entries.set(key, { value, userId, expiresAtMs });
  }

  dropUser(userId: string): void {
    this.generation++;
    for (const [key, e] of this.entries) if (e.userId === userId) this.entries.delete(key);
  }

  clear(): void {
    this.generation++;
    this.entries.clear();
  }
}

export interface CachedTokenActor {
  tokenId: string;
  userId: string;
  email: string;
  name: string;
  role: Role;
  /** When this instance last recorded the token's use (kept to the minute). */
  lastUsedMs: number;
}

export interface CachedUser {
  id: string;
  email: string;
  name: string;
  role: Role;
  disabled: boolean;
  sessionEpoch: number;
}

interface Caches {
  tokens: ActorCache<CachedTokenActor>;
  users: ActorCache<CachedUser>;
  listener?: { stop(): Promise<void> };
}

const globalForCache = globalThis as unknown as { loopkeeperActorCaches?: Caches };

/** The process's caches; the first use starts listening for changes. */
export function actorCaches(): Caches {
  let c = globalForCache.loopkeeperActorCaches;
  if (!c) {
    c = { tokens: new ActorCache<CachedTokenActor>(), users: new ActorCache<CachedUser>() };
    globalForCache.loopkeeperActorCaches = c;
  }
  if (!c.listener) {
    const caches = c;
    caches.listener = listenActorChanges({
      onUser(userId) {
        caches.tokens.dropUser(userId);
        caches.users.dropUser(userId);
      },
      onListening(listening) {
        for (const cache of [caches.tokens, caches.users]) {
          cache.clear();
          cache.listening = listening;
        }
      },
    });
    beforeCloseDb(stopActorCaches);
  }
  return c;
}

/** Stops listening and forgets everything (graceful shutdown, tests). The next use starts again. */
export async function stopActorCaches(): Promise<void> {
  const c = globalForCache.loopkeeperActorCaches;
  if (!c?.listener) return;
  const { listener } = c;
  c.listener = undefined;
  await listener.stop();
}
