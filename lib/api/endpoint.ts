import type { z } from "zod";
import { isJsonResponse, type Operation, type ResponseSpec } from "./operation";

export type AnyOperation = Operation<z.ZodType | undefined, z.ZodType | undefined, z.ZodType | undefined, ResponseSpec>;

/** How a success answer comes back: a JSON body, a file, or nothing (204). */
export type ResponseKind = "json" | "file" | "no_content";

/**
 * What the browser needs of an operation to call it: its id (the query key), method, path and
 * the kind of answer, with the operation's input and answer types carried as a type only. The
 * operation itself holds its zod schemas; importing it in a screen would ship zod and every
 * schema of its area to the browser, where nothing parses with them (the server does).
 * `lib/api/endpoints.ts` holds one of these per operation, generated from the operations.
 */
export interface Endpoint<O extends AnyOperation = AnyOperation> {
  readonly id: string;
  readonly method: Operation["method"];
  readonly path: string;
  readonly response: ResponseKind;
  /** Never set: names the operation this endpoint calls, for its types. */
  readonly operation?: O;
}

export function endpoint<O extends AnyOperation>(e: { id: string; method: Operation["method"]; path: string; response: ResponseKind }): Endpoint<O> {
  return e;
}

/** The kind of answer an operation's response spec declares. */
export function responseKind(spec: ResponseSpec): ResponseKind {
  return isJsonResponse(spec) ? "json" : spec.kind;
}

/** An operation or its endpoint: what the typed client calls. */
export type Callable = AnyOperation | Endpoint;

/** The operation behind a callable. */
export type OperationOf<C> = C extends Endpoint<infer O> ? O : C;

/** The answer kind of an operation or endpoint. */
export function kindOf(c: Callable): ResponseKind {
  return typeof c.response === "string" ? c.response : responseKind(c.response);
}
