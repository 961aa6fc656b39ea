import { sha256, toHex } from "../checksums/sha256";

/**
 * Canonical JSON: object keys sorted by UTF-16 code units, no whitespace,
 * numbers and strings as JSON.stringify writes them, undefined members left
 * out. Two documents with the same content give the same text whatever their
 * key order or formatting, so the content hash identifies content.
 */
export function canonicalJson(value: unknown): string {
  if (value === null || typeof value !== "object") {
    const s = JSON.stringify(value);
    return s === undefined ? "null" : s;
  }
  if (Array.isArray(value)) return `[${value.map((v) => canonicalJson(v)).join(",")}]`;
  const record = value as Record<string, unknown>;
  const keys = Object.keys(record)
    .filter((k) => record[k] !== undefined)
    .sort();
  return `{${keys.map((k) => `${JSON.stringify(k)}:${canonicalJson(record[k])}`).join(",")}}`;
}

/** SHA-256 of the UTF-8 canonical JSON of a document, lower-case hex (64 chars). */
export function contentHashHex(document: unknown): string {
  return toHex(sha256(new TextEncoder().encode(canonicalJson(document))));
}
