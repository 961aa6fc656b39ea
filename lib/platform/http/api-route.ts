import "server-only";
import { randomUUID } from "node:crypto";
import { NextResponse, type NextRequest } from "next/server";
import { z } from "zod";
import { AppError, type FieldIssue } from "@/lib/api/errors";
import { isJsonResponse, type HandlerResult, type InputOf, type Operation, type ResponseSpec } from "@/lib/api/operation";
import { can } from "@/lib/auth/roles";
import { getSessionActor, getTokenActor, type Actor } from "@/lib/platform/auth/actor";
import { fromDbError } from "@/lib/platform/http/db-errors";
import { env } from "@/lib/platform/env";
import { logger } from "@/lib/platform/log";
import { readCappedBody } from "@/lib/platform/http/raw-body";
import { MissingObjectError } from "@/lib/platform/storage/types";
import { enforceRequestBudget } from "@/lib/platform/http/rate-limit";

const DEFAULT_MAX_BODY = 256 * 1024;

export interface HandlerContext<Q, B, P> {
  req: NextRequest;
  actor: Actor;
  query: Q;
  body: B;
  params: P;
  requestId: string;
}

export function zodIssues(error: z.ZodError): FieldIssue[] {
  return error.issues.map((i) => ({ path: i.path.length ? "/" + i.path.map(String).join("/") : "", message: i.message }));
}

async function readJsonBody(req: NextRequest, maxBytes: number): Promise<unknown> {
  const type = req.headers.get("content-type") ?? "";
  if (!/^application\/json\b/i.test(type)) {
    throw new AppError("unsupported_media_type", "Send the body as JSON with Content-Type: application/json.");
  }
  const text = (await readCappedBody(req, maxBytes, `The body is larger than ${maxBytes} bytes.`)).toString("utf8");
  if (!text.trim()) throw new AppError("bad_request", "The body is empty; send a JSON object.");
  try {
    return JSON.parse(text) as unknown;
  } catch (err) {
    throw new AppError("bad_request", `The body is not valid JSON: ${err instanceof Error ? err.message : "parse error"}.`);
  }
}

function parseWith<T extends z.ZodType>(schema: T, value: unknown, where: string): z.infer<T> {
  const r = schema.safeParse(value);
  if (!r.success) {
    throw new AppError(where === "body" ? "validation_failed" : "bad_request", `Some ${where} fields are not valid.`, { issues: zodIssues(r.error) });
  }
  return r.data;
}

/** Browsers send Origin on cross-site requests; a cookie-authenticated write from elsewhere is refused. */
function checkOrigin(req: NextRequest): void {
  const origin = req.headers.get("origin");
  if (!origin) return;
  const allowed = new Set([new URL(env().NEXTAUTH_URL).origin, req.nextUrl.origin]);
  const host = req.headers.get("host");
  if (host) allowed.add(`${req.nextUrl.protocol}//${host}`);
  if (!allowed.has(origin)) throw new AppError("forbidden", "Cross-site requests are not accepted.");
}

export async function resolveActor(req: NextRequest): Promise<Actor | null> {
  const auth = req.headers.get("authorization");
  if (auth) return getTokenActor(auth);
  return getSessionActor();
}

export function errorResponse(err: unknown, requestId: string): NextResponse {
  // A row that points at bytes storage no longer has: the caller can upload again, it is not our crash.
  if (err instanceof MissingObjectError) return errorResponse(new AppError("gone", "A stored file this needs is no longer in file storage; upload it again."), requestId);
  const known = fromDbError(err);
  if (known) {
    return NextResponse.json(known.toBody(), { status: known.status, headers: { "x-request-id": requestId, ...known.headers } });
  }
  logger.error({ requestId, err: err instanceof Error ? { message: err.message, stack: err.stack } : String(err) }, "unhandled error");
  const body = new AppError("internal", `Something went wrong on our side (request ${requestId}). It has been logged.`).toBody();
  return NextResponse.json(body, { status: 500, headers: { "x-request-id": requestId } });
}

/**
 * Wraps a route handler with the same steps everywhere: who is calling (session or bearer
 * token; 401), which role (403), inputs parsed with the operation's zod schemas (400/413/415/422),
 * typed errors mapped to statuses, unknown errors logged and answered without detail.
 */
export function apiRoute<Q extends z.ZodType | undefined, B extends z.ZodType | undefined, P extends z.ZodType | undefined, R extends ResponseSpec>(
  op: Operation<Q, B, P, R>,
  handler: (ctx: HandlerContext<InputOf<Q>, InputOf<B>, InputOf<P>>) => Promise<HandlerResult<R>>,
) {
  return async (req: NextRequest, routeCtx: { params: Promise<Record<string, string | string[]>> }): Promise<Response> => {
    const requestId = req.headers.get("x-request-id")?.slice(0, 64) || randomUUID();
    const started = performance.now();
    let status = 500;
    try {
      let actor: Actor | null = null;
      if (op.access !== "public") {
        actor = await resolveActor(req);
        if (!actor) throw new AppError("unauthorized", "Sign in, or send a valid API token as Authorization: Bearer <token>.");
        if (op.access !== "signed_in" && !can(actor.role, op.access)) {
          throw new AppError("forbidden", `Your role (${actor.role}) may not do this.`);
        }
        if (actor.via === "session" && op.method !== "GET") checkOrigin(req);
        await enforceRequestBudget(actor);
      }
      const rawParams: unknown = (await routeCtx?.params) ?? {};
      const params = op.params ? parseWith(op.params, rawParams, "path") : undefined;
      const query = op.query ? parseWith(op.query, Object.fromEntries(req.nextUrl.searchParams), "query") : undefined;
      const body = op.body ? parseWith(op.body, await readJsonBody(req, op.maxBodyBytes ?? DEFAULT_MAX_BODY), "body") : undefined;
      const result = await handler({
        req,
        actor: actor as Actor,
        query: query as InputOf<Q>,
        body: body as InputOf<B>,
        params: params as InputOf<P>,
        requestId,
      });
      if (!isJsonResponse(op.response)) {
        if (result instanceof Response) {
          status = result.status;
          result.headers.set("x-request-id", requestId);
          return result;
        }
        status = 204;
        return new NextResponse(null, { status, headers: { "x-request-id": requestId } });
      }
      status = op.successStatus ?? 200;
      if (status === 204) return new NextResponse(null, { status, headers: { "x-request-id": requestId } });
      // The declared schema shapes the body: Dates become ISO strings and columns the
      // operation does not declare are left out, so the answer is what the contract says.
      return NextResponse.json(op.response.parse(result), { status, headers: { "x-request-id": requestId } });
    } catch (err) {
      const res = errorResponse(err, requestId);
      status = res.status;
      return res;
    } finally {
      logger.info({ requestId, method: req.method, path: req.nextUrl.pathname, status, ms: Math.round(performance.now() - started) }, "request");
    }
  };
}
