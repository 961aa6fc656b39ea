import "server-only";
import { QueryClient, dehydrate, type DehydratedState } from "@tanstack/react-query";
import { forbidden, notFound } from "next/navigation";
import type { z } from "zod";
import { AppError } from "@/lib/api/errors";
import type { Operation } from "@/lib/api/operation";
import { operationKey } from "@/lib/api/query-key";
import { can } from "@/lib/auth/roles";
import type { Actor } from "@/lib/platform/auth/actor";

type Parsed<T> = T extends z.ZodType ? z.output<T> : undefined;

/** One answer a page loads on the server: the operation it stands for, its raw inputs, and the read behind it. */
export interface ScreenQuery {
  op: Operation;
  key: readonly unknown[];
  run: () => Promise<unknown> | null;
}

/**
 * Names an answer the page puts in the browser's cache: the operation (for its id, access and
 * input schemas), the inputs as the browser would send them (path parameters, query strings),
 * and `load`, the same use-case or query function the operation's route handler calls. The
 * inputs go through the operation's own schemas, so defaults and coercion match the API's.
 */
export function screenQuery<Q extends z.ZodType, B extends z.ZodType, P extends z.ZodType>(
  op: Operation<Q, B, P>,
  input: { params?: Record<string, string>; query?: Record<string, string> },
  load: (parsed: { params: Parsed<P>; query: Parsed<Q> }) => Promise<unknown>,
): ScreenQuery {
  return {
    op,
    key: operationKey(op, input),
    run: () => {
      const params = op.params ? op.params.safeParse(input.params ?? {}) : undefined;
      const query = op.query ? op.query.safeParse(input.query ?? {}) : undefined;
      // Inputs the API would refuse: leave the answer to the browser, which shows the refusal.
      if (params?.success === false || query?.success === false) return null;
      return load({ params: params?.data as Parsed<P>, query: query?.data as Parsed<Q> });
    },
  };
}

/**
 * Loads a page's first data on the server and returns it as TanStack Query state for
 * `<HydrationBoundary>`: the page's HTML then carries its rows, and the browser's queries
 * start from them instead of a spinner. Each answer is turned into exactly what the API's
 * JSON would be (dates become ISO strings), and only for operations the actor may call.
 * A missing resource shows the not-found page, a refused one the 403 page; other failures
 * go to the section's error screen.
 */
export async function prefetchScreen(actor: Actor, queries: ScreenQuery[]): Promise<DehydratedState> {
  const client = new QueryClient();
  await Promise.all(
    queries.map(async (q) => {
      if (q.op.access !== "public" && q.op.access !== "signed_in" && !can(actor.role, q.op.access)) return;
      try {
        const pending = q.run();
        if (!pending) return;
        const data: unknown = JSON.parse(JSON.stringify(await pending));
        client.setQueryData(q.key, data);
      } catch (err) {
        if (err instanceof AppError && err.code === "not_found") notFound();
        if (err instanceof AppError && err.code === "forbidden") forbidden();
        throw err;
      }
    }),
  );
  return dehydrate(client);
}
