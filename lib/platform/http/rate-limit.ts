import "server-only";
import { beforeCloseDb, getDb } from "@/db/client";
import { addRateLimitCounts, pruneRateLimits } from "@/db/rate-limit";
import { AppError } from "@/lib/api/errors";
import { RequestBudget } from "@/lib/rate-limit/request-budget";
import type { Actor } from "@/lib/platform/auth/actor";
import { env } from "@/lib/platform/env";
import { logger } from "@/lib/platform/log";

const WINDOW_MS = 60_000;
/** How often unsent counts go to PostgreSQL, so other instances see them. */
const FLUSH_EVERY_MS = 1_000;
const PRUNE_EVERY_MS = 10 * 60_000;

interface BudgetState {
  budget: RequestBudget;
  timer: NodeJS.Timeout;
}

const globalForBudget = globalThis as unknown as { loopkeeperRequestBudget?: BudgetState };

function state(): BudgetState {
  let s = globalForBudget.loopkeeperRequestBudget;
  if (!s) {
    const budget = new RequestBudget({
      limitPerWindow: env().API_RATE_LIMIT_PER_MIN,
      windowMs: WINDOW_MS,
      store: { add: (increments) => addRateLimitCounts(getDb(), increments) },
    });
    let lastPruneMs = Date.now();
    const timer = setInterval(() => {
      budget.sweep();
      budget.flush().catch((err: unknown) => logger.warn({ err: err instanceof Error ? err.message : String(err) }, "rate-limit counts not flushed; kept for the next try"));
      if (Date.now() - lastPruneMs > PRUNE_EVERY_MS) {
        lastPruneMs = Date.now();
        pruneRateLimits(getDb()).catch(() => undefined);
      }
    }, FLUSH_EVERY_MS);
    // The timer must not keep a finishing process alive; shutdown flushes explicitly.
    timer.unref();
    s = { budget, timer };
    globalForBudget.loopkeeperRequestBudget = s;
    beforeCloseDb(stopRequestBudget);
  }
  return s;
}

/**
 * One request budget per person, whether they call with a session or with any of their API
 * tokens; 429 with Retry-After past it. Counted in the process and sent to PostgreSQL in
 * batches, so every instance shares the budget within the tolerance RequestBudget states.
 */
export async function enforceRequestBudget(actor: Pick<Actor, "userId">): Promise<void> {
  const { allowed, retryAfterSec } = await state().budget.take(`user:${actor.userId}`);
  if (!allowed) {
    const limit = env().API_RATE_LIMIT_PER_MIN;
    throw new AppError("rate_limited", `Too many requests: at most ${limit} a minute for your account, across all its sessions and API tokens. Try again in ${retryAfterSec} s.`, {
      headers: { "retry-after": String(retryAfterSec) },
    });
  }
}

/** Sends unsent counts and stops the timer (graceful shutdown, tests); the next request starts again. */
export async function stopRequestBudget(): Promise<void> {
  const s = globalForBudget.loopkeeperRequestBudget;
  if (!s) return;
  globalForBudget.loopkeeperRequestBudget = undefined;
  clearInterval(s.timer);
  await s.budget.flush().catch(() => undefined);
}
