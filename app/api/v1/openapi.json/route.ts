import { allOperations } from "@/lib/api/operations";
import { buildOpenApi } from "@/lib/api/openapi";
import { etagOf, ifNoneMatchHits } from "@/lib/platform/http/etag";
import pkg from "@/package.json";

interface BuiltDocument {
  body: string;
  etag: string;
}

// The operations are fixed for the life of the process, so the document is serialised once
// on first use; every later request only compares tags or copies the same string.
let built: BuiltDocument | undefined;

function document(): BuiltDocument {
  if (!built) {
    const body = JSON.stringify(buildOpenApi(allOperations, pkg.version));
    built = { body, etag: etagOf(body) };
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
  return new Response(body, { headers: { ...headers, "content-type": "application/json" } });
}
