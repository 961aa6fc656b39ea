/**
 * Compile-time checks of the API contract, run by `tsc --noEmit` (the lint stage). Each
 * `@ts-expect-error` line must fail to compile: if a change let a handler return a body
 * its operation does not declare, the directive would be unused and tsc would fail.
 */
import { expectTypeOf } from "vitest";
import { z } from "zod";
import { apiCall, apiQuery, type CallResult } from "@/lib/api/client";
import { defineOperation, fileResponse, noContent } from "@/lib/api/operation";
import type { AppError } from "@/lib/api/errors";
import { getBuild } from "@/lib/api/operations/builds";
import { apiRoute } from "@/lib/platform/http/api-route";
import type { UseQueryResult } from "@tanstack/react-query";

const readDial = defineOperation({
  id: "readDial",
  method: "GET",
  path: "/api/v1/dials/{id}",
  summary: "probe",
  tag: "Test",
  access: "read",
  params: z.strictObject({ id: z.uuid() }),
  response: z.object({ dutyPct: z.number(), label: z.string().nullable() }),
});

const setDial = defineOperation({
  id: "setDial",
  method: "PUT",
  path: "/api/v1/dials/{id}",
  summary: "probe",
  tag: "Test",
  access: "registry:write",
  params: z.strictObject({ id: z.uuid() }),
  body: z.strictObject({ dutyPct: z.number() }),
  response: noContent,
  successStatus: 204,
});

const downloadDial = defineOperation({
  id: "downloadDial",
  method: "GET",
  path: "/api/v1/dials/{id}/file",
  summary: "probe",
  tag: "Test",
  access: "read",
  params: z.strictObject({ id: z.uuid() }),
  response: fileResponse(["application/octet-stream"], "bytes"),
});

// A body that matches the declared response compiles.
export const matching = apiRoute(readDial, async ({ params }) => ({ dutyPct: params.id.length, label: null }));
// @ts-expect-error a body without a declared field is refused
export const missingField = apiRoute(readDial, async () => ({ dutyPct: 40 }));
// @ts-expect-error a field of the wrong type is refused
export const wrongType = apiRoute(readDial, async () => ({ dutyPct: "40", label: null }));
// @ts-expect-error a JSON operation cannot answer with a hand-built Response
export const handBuilt = apiRoute(readDial, async () => new Response("{}"));
// @ts-expect-error the handler's inputs are typed by the operation: the body is undefined for a GET
export const noBody = apiRoute(readDial, async ({ body }) => ({ dutyPct: body.dutyPct, label: null }));

export const noContentOk = apiRoute(setDial, async ({ body }) => void body.dutyPct);
// @ts-expect-error an operation answering 204 has no body to return
export const noContentBody = apiRoute(setDial, async () => ({ ok: true }));

export const fileOk = apiRoute(downloadDial, async () => new Response(new Uint8Array([1, 2])));
// @ts-expect-error a file operation builds its Response; JSON is not a file
export const fileAsJson = apiRoute(downloadDial, async () => ({ dutyPct: 1 }));

export async function clientCalls(id: string) {
  // The client call is typed by the same operation: inputs in, response out.
  expectTypeOf(await apiCall(readDial, { params: { id } })).toEqualTypeOf<{ dutyPct: number; label: string | null }>();
  expectTypeOf(await apiCall(setDial, { params: { id }, body: { dutyPct: 30 } })).toEqualTypeOf<undefined>();
  expectTypeOf(await apiCall(downloadDial, { params: { id } })).toEqualTypeOf<Blob>();
  expectTypeOf<CallResult<typeof getBuild>["build"]["stage"]>().toEqualTypeOf<"draft" | "review" | "validation" | "pilot" | "production" | "withdrawn">();
  // @ts-expect-error the path parameter is required
  await apiCall(readDial, {});
  // @ts-expect-error the body's fields are checked
  await apiCall(setDial, { params: { id }, body: { dutyPct: "30" } });
  expectTypeOf(apiQuery(readDial, { params: { id } }).queryKey).toEqualTypeOf<readonly unknown[]>();
}

// TanStack Query's error type is the API's AppError, so no component casts it.
expectTypeOf<UseQueryResult<number>["error"]>().toEqualTypeOf<AppError | null>();
