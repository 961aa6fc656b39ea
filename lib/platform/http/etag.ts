import "server-only";
import { createHash } from "node:crypto";

/** A strong entity tag for these bytes: a quoted SHA-256 prefix, stable across processes serving the same document. */
export function etagOf(body: string): string {
  return `"${createHash("sha256").update(body, "utf8").digest("base64url").slice(0, 32)}"`;
}

/**
 * Whether an If-None-Match header matches this entity tag, so the answer is 304. The
 * header is "*" or a comma-separated list of tags; If-None-Match compares weakly, so a
 * W/ prefix on either side is ignored.
 */
export function ifNoneMatchHits(header: string | null, etag: string): boolean {
  if (!header) return false;
  const trimmed = header.trim();
  if (trimmed === "*") return true;
  const opaque = (tag: string) => tag.trim().replace(/^W\//, "");
  const wanted = opaque(etag);
  return trimmed.split(",").some((tag) => opaque(tag) === wanted);
}
