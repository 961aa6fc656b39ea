import type { z } from "zod";
import { AppError, isErrorBody, type ErrorCode } from "./errors";
import { kindOf, type Callable, type OperationOf } from "./endpoint";
import type { Operation, ResponseBody, ResponseSpec, SendOf } from "./operation";

/** Drops the keys whose type allows undefined from being required. */
type Inputs<Q, B, P> = (P extends z.ZodType ? { params: SendOf<P> } : { params?: undefined }) &
  (Q extends z.ZodType ? { query?: SendOf<Q> } : { query?: undefined }) &
  (B extends z.ZodType ? { body: SendOf<B> } : { body?: undefined }) & {
    /** For operations whose body is a file (uploads, CSV, dumps): the bytes and their type. */
    raw?: { data: Blob | string | FormData | ArrayBuffer; contentType?: string };
  };

/** What a call of an operation (or its endpoint) sends: its path parameters, query and JSON body, each typed by the operation. */
export type CallInput<C> = OperationOf<C> extends Operation<infer Q, infer B, infer P, ResponseSpec> ? Inputs<Q, B, P> : never;
/** What a call of an operation (or its endpoint) answers with on success. */
export type CallResult<C> = OperationOf<C> extends Operation<infer _Q, infer _B, infer _P, infer R> ? ResponseBody<R> : never;

/** What the client needs to reach an operation: its id, method and path. */
type Target = Pick<Callable, "id" | "method" | "path">;

function plainEntries(value: unknown): [string, unknown][] {
  return typeof value === "object" && value !== null ? Object.entries(value) : [];
}

/** Path and query values are strings, numbers or booleans; anything else is sent as JSON. */
function scalar(value: unknown): string {
  return typeof value === "string" || typeof value === "number" || typeof value === "boolean" ? String(value) : JSON.stringify(value);
}

/** The operation's URL: `{name}` segments filled from the path parameters, the query appended (empty values left out). */
export function operationUrl(op: Target, input: { params?: unknown; query?: unknown } = {}): string {
  const params = new Map(plainEntries(input.params));
  const path = op.path.replace(/\{(\w+)\}/g, (_, name: string) => {
    const value = params.get(name);
    if (value === undefined || value === null || value === "") throw new AppError("bad_request", `The ${name} of ${op.id} is missing.`);
    return encodeURIComponent(scalar(value));
  });
  const search = new URLSearchParams();
  for (const [k, v] of plainEntries(input.query)) {
    if (v === undefined || v === null || v === "") continue;
    search.set(k, scalar(v));
  }
  const qs = search.toString();
  return qs ? `${path}?${qs}` : path;
}

/**
 * The TanStack Query key of an operation's answer: its id, then its path parameters and
 * query. Invalidating `[op.id]` refreshes every answer of that operation;
 * `operationKey(op, { params })` those of one resource.
 */
export function operationKey(op: Target, input: { params?: unknown; query?: unknown } = {}): readonly unknown[] {
  const key: unknown[] = [op.id];
  if (input.params !== undefined || input.query !== undefined) key.push(input.params ?? {});
  if (input.query !== undefined) key.push(input.query);
  return key;
}

async function send(url: string, init: RequestInit): Promise<Response> {
  try {
    return await fetch(url, init);
  } catch (err) {
    if (err instanceof DOMException && err.name === "AbortError") throw err;
    throw new AppError("unavailable", "Could not reach the Loopkeeper server. Check your connection and try again.");
  }
}

async function failure(res: Response): Promise<AppError> {
  return errorFromText(res.status, await res.text());
}

/** The AppError of a failed answer: the server's own error body, or one made from the status. */
function errorFromText(status: number, text: string): AppError {
  let body: unknown;
  try {
    body = JSON.parse(text);
  } catch {
    body = undefined;
  }
  if (isErrorBody(body)) return new AppError(body.error.code, body.error.message, { issues: body.error.issues });
  const code: ErrorCode = status === 503 ? "unavailable" : status === 401 ? "unauthorized" : status === 403 ? "forbidden" : status === 404 ? "not_found" : "internal";
  return new AppError(code, `The server answered ${status}.`);
}

/**
 * The one client call: takes an operation and its typed inputs, builds the URL from the
 * operation's path, and answers with the operation's response type. A failed response
 * becomes the same AppError the server threw, so forms can show its message and field issues.
 */
export async function apiCall<O extends Callable>(op: O, input: CallInput<O>, init: { signal?: AbortSignal } = {}): Promise<CallResult<O>> {
  const { params, query, body, raw } = input as { params?: unknown; query?: unknown; body?: unknown; raw?: { data: BodyInit; contentType?: string } };
  const headers: Record<string, string> = { accept: "application/json" };
  let payload: BodyInit | undefined;
  if (raw) {
    payload = raw.data;
    if (raw.contentType) headers["content-type"] = raw.contentType;
  } else if (body !== undefined) {
    payload = JSON.stringify(body);
    headers["content-type"] = "application/json";
  }
  const res = await send(operationUrl(op, { params, query }), { method: op.method, headers, body: payload, signal: init.signal });
  if (!res.ok) throw await failure(res);
  const kind = kindOf(op);
  if (kind !== "json") {
    return (kind === "file" ? await res.blob() : undefined) as CallResult<O>;
  }
  const text = await res.text();
  try {
    // The server built this body from the operation's response schema (the handler's type says so).
    return JSON.parse(text) as CallResult<O>;
  } catch {
    throw new AppError("internal", "The server's answer was not JSON.");
  }
}

/** Query options for `useQuery`/`prefetchQuery`: the key derived from the operation, the typed call as the fetcher. */
export function apiQuery<O extends Callable>(op: O, input: CallInput<O>) {
  const { params, query } = input as { params?: unknown; query?: unknown };
  return {
    queryKey: operationKey(op, { params, query }),
    queryFn: ({ signal }: { signal: AbortSignal }) => apiCall(op, input, { signal }),
  };
}

/**
 * Screen state from the URL read as an operation's query: values the schema refuses are
 * dropped (the server would refuse them too), so a hand-edited URL shows the default list
 * instead of an error.
 */
export function queryFromUrl<S extends z.ZodType>(schema: S, raw: Record<string, string>): z.output<S> {
  const entries = { ...raw };
  for (let attempt = 0; attempt < 3; attempt++) {
    const r = schema.safeParse(entries);
    if (r.success) return r.data;
    for (const issue of r.error.issues) delete entries[String(issue.path[0])];
  }
  return schema.parse({});
}

/** How far an upload has got: bytes sent of the total (the browser's own count). */
export interface UploadProgress {
  sentBytes: number;
  totalBytes: number;
}

/**
 * `apiCall` for file bodies, over XMLHttpRequest because fetch cannot report upload progress:
 * `onProgress` hears as the bytes go out, `onText` gets the answer's text as it arrives (for
 * answers streamed line by line), and aborting `signal` cancels the request. Errors are the
 * same AppError as `apiCall` throws; a cancel rejects with an AbortError DOMException.
 */
export function apiUpload<O extends Callable>(
  op: O,
  input: CallInput<O>,
  { onProgress, onText, signal, accept = "application/json" }: { onProgress?: (p: UploadProgress) => void; onText?: (textSoFar: string) => void; signal?: AbortSignal; accept?: string } = {},
): Promise<{ status: number; text: string }> {
  const { params, query, raw } = input as { params?: unknown; query?: unknown; raw?: { data: XMLHttpRequestBodyInit; contentType?: string } };
  return new Promise((resolve, reject) => {
    if (signal?.aborted) return reject(new DOMException("The upload was cancelled.", "AbortError"));
    const xhr = new XMLHttpRequest();
    xhr.open(op.method, operationUrl(op, { params, query }));
    xhr.setRequestHeader("accept", accept);
    if (raw?.contentType) xhr.setRequestHeader("content-type", raw.contentType);
    xhr.upload.onprogress = (e) => onProgress?.({ sentBytes: e.loaded, totalBytes: e.lengthComputable ? e.total : 0 });
    xhr.onprogress = () => onText?.(xhr.responseText);
    const onAbort = () => xhr.abort();
    signal?.addEventListener("abort", onAbort, { once: true });
    xhr.onabort = () => reject(new DOMException("The upload was cancelled.", "AbortError"));
    xhr.onerror = () => reject(new AppError("unavailable", "Could not reach the Loopkeeper server. Check your connection and try again."));
    xhr.onload = () => {
      signal?.removeEventListener("abort", onAbort);
      onText?.(xhr.responseText);
      if (xhr.status >= 200 && xhr.status < 300) resolve({ status: xhr.status, text: xhr.responseText });
      else reject(errorFromText(xhr.status, xhr.responseText));
    };
    xhr.send(raw?.data ?? null);
  });
}

/** `apiUpload` for a JSON answer, typed by the operation. */
export async function apiUploadJson<O extends Callable>(op: O, input: CallInput<O>, options: { onProgress?: (p: UploadProgress) => void; signal?: AbortSignal } = {}): Promise<CallResult<O>> {
  const { text } = await apiUpload(op, input, options);
  try {
    // The server built this body from the operation's response schema (the handler's type says so).
    return JSON.parse(text) as CallResult<O>;
  } catch {
    throw new AppError("internal", "The server's answer was not JSON.");
  }
}
