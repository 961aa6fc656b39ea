import { AppError, isErrorBody, type ErrorCode } from "./errors";

/**
 * The one client fetcher: JSON in, JSON out, and a failed response becomes the same
 * AppError the server threw, so forms can show its message and field issues.
 */
export async function apiFetch<T>(url: string, init: RequestInit & { json?: unknown } = {}): Promise<T> {
  const { json, headers, ...rest } = init;
  let res: Response;
  try {
    res = await fetch(url, {
      ...rest,
      headers: { accept: "application/json", ...(json !== undefined ? { "content-type": "application/json" } : {}), ...headers },
      body: json !== undefined ? JSON.stringify(json) : rest.body,
    });
  } catch {
    throw new AppError("unavailable", "Could not reach the Loopkeeper server. Check your connection and try again.");
  }
  const text = await res.text();
  let body: unknown = undefined;
  if (text) {
    try {
      body = JSON.parse(text);
    } catch {
      body = undefined;
    }
  }
  if (!res.ok) {
    if (isErrorBody(body)) throw new AppError(body.error.code, body.error.message, { issues: body.error.issues });
    const code: ErrorCode = res.status === 503 ? "unavailable" : res.status === 401 ? "unauthorized" : res.status === 403 ? "forbidden" : "internal";
    throw new AppError(code, `The server answered ${res.status}.`);
  }
  return body as T;
}
