import "server-only";
import { Client } from "pg";
import { env } from "@/lib/platform/env";

/** The channel the users and api_tokens triggers announce access changes on (payload: the user id). */
export const ACTOR_CHANGED_CHANNEL = "loopkeeper_actor_changed";

export interface ActorChangeHandlers {
  /** A user's role, state, password, sessions or tokens changed: drop what is cached for them. */
  onUser(userId: string): void;
  /** Listening started (true) or stopped (false): nothing may be cached while notices could be missed. */
  onListening(listening: boolean): void;
}

/**
 * Listens for access changes on one dedicated connection (LISTEN needs a session of its own,
 * not a pooled one) and reconnects after a second when it drops. Returns a stop function.
 */
export function listenActorChanges(handlers: ActorChangeHandlers): { stop(): Promise<void> } {
  let client: Client | undefined;
  let stopped = false;
  let retry: NodeJS.Timeout | undefined;

  const connect = async () => {
    const c = new Client({ connectionString: env().DATABASE_URL, connectionTimeoutMillis: 3000 });
    client = c;
    const lost = () => {
      if (client !== c) return;
      client = undefined;
      handlers.onListening(false);
      c.end().catch(() => undefined);
      if (!stopped) retry = setTimeout(() => void connect(), 1000).unref();
    };
    c.on("error", lost);
    c.on("end", lost);
    c.on("notification", (msg) => {
      if (msg.channel === ACTOR_CHANGED_CHANNEL && msg.payload) handlers.onUser(msg.payload);
    });
    try {
      await c.connect();
      await c.query(`LISTEN ${ACTOR_CHANGED_CHANNEL}`);
      if (stopped || client !== c) return void c.end().catch(() => undefined);
      handlers.onListening(true);
    } catch {
      lost();
    }
  };
  void connect();
  return {
    async stop() {
      stopped = true;
      if (retry) clearTimeout(retry);
      const c = client;
      client = undefined;
      handlers.onListening(false);
      await c?.end().catch(() => undefined);
    },
  };
}
