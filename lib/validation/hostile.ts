import { escapePointerSegment } from "./json-scan";
import type { ValidationIssue } from "./types";

/** Deepest nesting accepted; profiles need 4 levels. */
export const MAX_DEPTH = 32;
/** Most values accepted in one document. */
export const MAX_NODES = 200_000;

interface Entry {
  value: unknown;
  parent: Entry | null;
  key: string;
  depth: number;
}

// Paths are built only for values that have an issue: building one per value costs more than the walk.
function pathOf(entry: Entry): string {
  const keys: string[] = [];
  for (let e: Entry | null = entry; e && e.parent; e = e.parent) keys.push(escapePointerSegment(e.key));
  return keys.length === 0 ? "" : `/${keys.reverse().join("/")}`;
}

/**
 * Guards the schema and rules against documents no JSON text can produce or
 * that are built to hurt: NaN/Infinity, cycles, very deep nesting, huge
 * sizes. Returns issues (at most 20); never throws.
 */
export function hostileValueIssues(doc: unknown): ValidationIssue[] {
  const issues: ValidationIssue[] = [];
  let nodes = 0;
  const stack: Entry[] = [{ value: doc, parent: null, key: "", depth: 0 }];
  while (stack.length > 0 && issues.length < 20) {
    const entry = stack.pop()!;
    const { value, depth } = entry;
    if (++nodes > MAX_NODES) {
      issues.push({ code: "json.too_large", path: "", severity: "error", message: `The document holds more than ${MAX_NODES} values; a profile needs a few hundred.` });
      break;
    }
    if (typeof value === "number" && !Number.isFinite(value)) {
      issues.push({ code: "value.not_finite", path: pathOf(entry), severity: "error", message: `${String(value)} is not a number JSON can hold: write a finite number.` });
    } else if (typeof value === "bigint" || typeof value === "function" || typeof value === "symbol") {
      issues.push({ code: "value.not_json", path: pathOf(entry), severity: "error", message: `A ${typeof value} is not a JSON value: write a number, string, boolean, null, array or object.` });
    } else if (typeof value === "object" && value !== null) {
      if (depth >= MAX_DEPTH) {
        issues.push({ code: "json.too_deep", path: pathOf(entry), severity: "error", message: `Nesting deeper than ${MAX_DEPTH} levels (or a cycle); a profile needs only a few.` });
        continue;
      }
      if (Array.isArray(value)) {
        if (value.length > MAX_NODES) {
          issues.push({ code: "json.too_large", path: pathOf(entry), severity: "error", message: `The array holds ${value.length} items; far more than a profile needs.` });
          continue;
        }
        for (let i = value.length - 1; i >= 0; i--) stack.push({ value: value[i], parent: entry, key: String(i), depth: depth + 1 });
      } else {
        for (const key of Object.keys(value)) {
          stack.push({ value: (value as Record<string, unknown>)[key], parent: entry, key, depth: depth + 1 });
        }
      }
    }
  }
  return issues;
}
