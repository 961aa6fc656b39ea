import "server-only";
import { QueryClient, dehydrate, type DehydratedState } from "@tanstack/react-query";
import { forbidden, notFound } from "next/navigation";
import type { z } from "zod";
import { operationKey, operationUrl, type CallInput } from "@/lib/api/client";
import { AppError } from "@/lib/api/errors";
import { isJsonResponse, type HandlerResult, type InputOf, type Operation, type ResponseSpec } from "@/lib/api/operation";
import { can } from "@/lib/auth/roles";
import type { Actor } from "@/lib/platform/auth/actor";

/** One answer a page loads on the server: the operation it stands for, its query key, and the read behind it. */
export interface ScreenQuery {
  op: Operation;
  key: readonly unknown[];
  run: () => Promise<unknown> | null;
}

type AnyOperation = Operation<z.ZodType | undefined, z.ZodType | undefined, z.ZodType | undefined, ResponseSpec>;
type ParsedInputs<O> = O extends Operation<infer Q, infer _B, infer P, ResponseSpec> ? { params: InputOf<P>; query: InputOf<Q> } : never;
type LoadResult<O> = O extends Operation<infer _Q, infer _B, infer _P, infer R> ? HandlerResult<R> : never;

/** Path parameters as the route handler receives them: strings. */
function pathStrings(params: unknown): Record<string, string> {
  const out: Record<string, string> = {};
  if (typeof params !== "object" || params === null) return out;
  for (const [k, v] of Object.entries(params)) if (v !== undefined && v !== null) out[k] = typeof v === "object" ? JSON.stringify(v) : String(v as string | number | boolean);
  return out;
}

/**
 * Names an answer the page puts in the browser's cache: the operation, its inputs exactly as
 * the screen's `apiQuery(op, input)` passes them (so the query key is the same), and `load`,
 * the use case the operation's route handler calls. The inputs travel the way the browser's
 * request would (through the operation's URL) and are parsed by the operation's own schemas,
 * so defaults and coercion match the API's.
 */
export function screenQuery<O extends AnyOperation>(op: O, input: CallInput<O>, load: (parsed: ParsedInputs<O>) => Promise<LoadResult<O>>): ScreenQuery {
  const { params, query } = input as { params?: unknown; query?: unknown };
  return {
    op,
    key: operationKey(op, { params, query }),
    run: () => {
      const url = new URL(operationUrl(op, { params, query }), "http://screen.invalid");
      const parsedParams = op.params ? op.params.safeParse(pathStrings(params)) : undefined;
      const parsedQuery = op.query ? op.query.safeParse(Object.fromEntries(url.searchParams)) : undefined;
      // Inputs the API would refuse: leave the answer to the browser, which shows the refusal.
      if (parsedParams?.success === false || parsedQuery?.success === false) return null;
      return load({ params: parsedParams?.data, query: parsedQuery?.data } as ParsedInputs<O>).then((result) =>
        // The body the route would send: shaped by the declared response schema.
        isJsonResponse(op.response) ? op.response.parse(result) : result,
      );
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
