import type { z } from "zod";
import type { Capability } from "@/lib/auth/roles";

/**
 * One API operation: its method, path, who may call it and the zod schemas of its inputs
 * and output. Route handlers are built from these, and the OpenAPI document is generated
 * from the same objects, so the contract cannot drift from the code.
 */
export interface Operation<
  Q extends z.ZodType = z.ZodType,
  B extends z.ZodType = z.ZodType,
  P extends z.ZodType = z.ZodType,
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
  response?: z.ZodType;
  successStatus?: 200 | 201 | 204;
  maxBodyBytes?: number;
}

export function defineOperation<Q extends z.ZodType, B extends z.ZodType, P extends z.ZodType>(op: Operation<Q, B, P>): Operation<Q, B, P> {
  return op;
}
