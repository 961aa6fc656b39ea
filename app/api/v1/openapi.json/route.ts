import { allOperations } from "@/lib/api/operations";
import { buildOpenApi } from "@/lib/api/openapi";
import { etagOf, ifNoneMatchHits } from "@/lib/platform/http/etag";
import pkg from "@/package.json";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

interface BuiltDocument {
  body: Uint8Array<ArrayBuffer>;
  etag: string;
}

// The operations are fixed for the life of the process, so the document is serialised and
// encoded as UTF-8 once on first use; every later request only compares tags or writes the same
// bytes (no re-encoding of a large string per request).
let built: BuiltDocument | undefined;

function document(): BuiltDocument {
  if (!built) {
    const text = JSON.stringify(buildOpenApi(allOperations, pkg.version));
    built = { body: new TextEncoder().encode(text), etag: etagOf(text) };
  }
  return built;
}

/**
 * The OpenAPI document, generated from the same zod schemas the handlers parse with. Clients
 * revalidate with If-None-Match and get 304 while the deployed operations are unchanged.
 */
export function GET(req: Request): Response {
  const { body, etag } = document();
  const headers = { etag, "cache-control": "public, no-cache" };
  if (ifNoneMatchHits(req.headers.get("if-none-match"), etag)) return new Response(null, { status: 304, headers });
  return new Response(body, { headers: { ...headers, "content-type": "application/json", "content-length": String(body.byteLength) } });
}
