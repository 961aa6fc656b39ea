import type { z } from "zod";
import type { Capability } from "@/lib/auth/roles";

/** A success answer that is a file (bank image, CSV, PDF…), not JSON; the handler builds the Response itself. */
export interface FileResponse {
  kind: "file";
  contentTypes: readonly string[];
  description: string;
}

/** A success answer with no body (204). */
export interface NoContent {
  kind: "no_content";
}

/** Every operation says what a success looks like: a zod schema for JSON, a file, or no body. */
export type ResponseSpec = z.ZodType | FileResponse | NoContent;

export function fileResponse(contentTypes: readonly string[], description: string): FileResponse {
  return { kind: "file", contentTypes, description };
}

export const noContent: NoContent = { kind: "no_content" };

/**
 * One API operation: its method, path, who may call it and the zod schemas of its inputs
 * and output. Route handlers are built from these, the typed client calls them, and the
 * OpenAPI document is generated from the same objects, so the contract cannot drift from
 * the code.
 */
export interface Operation<
  Q extends z.ZodType | undefined = z.ZodType | undefined,
  B extends z.ZodType | undefined = z.ZodType | undefined,
  P extends z.ZodType | undefined = z.ZodType | undefined,
  R extends ResponseSpec = ResponseSpec,
> {
  id: string;
  method: "GET" | "POST" | "PUT" | "PATCH" | "DELETE";
  /** OpenAPI-style path, e.g. /api/v1/tokens/{id}. */
  path: string;
  summary: string;
  tag: string;
  /** "public" needs no sign-in; "signed_in" any role; otherwise the capability's roles. */
  access: Capability | "public" | "signed_in";
  query?: Q;
  body?: B;
  params?: P;
  /** Body is not JSON (e.g. a multipart upload); the handler reads it itself. */
  rawBody?: { contentTypes: string[]; maxBytes: number };
  response: R;
  successStatus?: 200 | 201 | 204;
  maxBodyBytes?: number;
}

export function defineOperation<
  R extends ResponseSpec,
  Q extends z.ZodType | undefined = undefined,
  B extends z.ZodType | undefined = undefined,
  P extends z.ZodType | undefined = undefined,
>(op: Operation<Q, B, P, R>): Operation<Q, B, P, R> {
  return op;
}

/** The parsed value of an optional input schema; undefined when the operation has none. */
export type InputOf<T> = T extends z.ZodType ? z.output<T> : undefined;
/** What a caller sends for an optional input schema (before defaults and coercion). */
export type SendOf<T> = T extends z.ZodType ? z.input<T> : undefined;

/** What a route handler must return for an operation's response. */
export type HandlerResult<R> = R extends FileResponse ? Response : R extends NoContent ? void : R extends z.ZodType ? z.input<R> : never;

/** What a client receives on success. */
export type ResponseBody<R> = R extends FileResponse ? Blob : R extends NoContent ? undefined : R extends z.ZodType ? z.output<R> : never;

export type OperationResponse<O> = O extends Operation<infer _Q, infer _B, infer _P, infer R> ? ResponseBody<R> : never;

export function isJsonResponse(r: ResponseSpec): r is z.ZodType {
  return "_zod" in r;
}
