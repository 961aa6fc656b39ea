import { escapePointerSegment } from "./json-scan";
import type { ValidationIssue } from "./types";

/** Deepest nesting accepted; profiles need 4 levels. */
export const MAX_DEPTH = 32;
/** Most values accepted in one document. */
export const MAX_NODES = 200_000;

/** Walk state: issues so far, values seen, and the keys from the root to the value being looked at. */
interface Walk {
  issues: ValidationIssue[];
  nodes: number;
  /** Member names, and item indexes as numbers (made text only for a path). */
  keys: (string | number)[];
  /** Set when the walk must end (too many values). */
  stopped: boolean;
}

// Paths are built only for values that have an issue: building one per value costs more than the walk.
function pathOf(walk: Walk): string {
  return walk.keys.length === 0 ? "" : `/${walk.keys.map((k) => (typeof k === "number" ? String(k) : escapePointerSegment(k))).join("/")}`;
}

/**
 * Depth-first, in the order the issues are listed: array items first to last, object
 * members last to first (the order of the explicit stack this walk once kept).
 */
const walkEnded = (walk: Walk): boolean => walk.stopped || walk.issues.length >= 20;

function visit(value: unknown, depth: number, walk: Walk): void {
  const { issues } = walk;
  if (walkEnded(walk)) return;
  if (++walk.nodes > MAX_NODES) {
    issues.push({ code: "json.too_large", path: "", severity: "error", message: `The document holds more than ${MAX_NODES} values; a profile needs a few hundred.` });
    walk.stopped = true;
    return;
  }
  if (typeof value === "number") {
    if (!Number.isFinite(value)) issues.push({ code: "value.not_finite", path: pathOf(walk), severity: "error", message: `${String(value)} is not a number JSON can hold: write a finite number.` });
  } else if (typeof value === "bigint" || typeof value === "function" || typeof value === "symbol") {
    issues.push({ code: "value.not_json", path: pathOf(walk), severity: "error", message: `A ${typeof value} is not a JSON value: write a number, string, boolean, null, array or object.` });
  } else if (typeof value === "object" && value !== null) {
    if (depth >= MAX_DEPTH) {
      issues.push({ code: "json.too_deep", path: pathOf(walk), severity: "error", message: `Nesting deeper than ${MAX_DEPTH} levels (or a cycle); a profile needs only a few.` });
      return;
    }
    const { keys } = walk;
    if (Array.isArray(value)) {
      if (value.length > MAX_NODES) {
        issues.push({ code: "json.too_large", path: pathOf(walk), severity: "error", message: `The array holds ${value.length} items; far more than a profile needs.` });
        return;
      }
      const items: readonly unknown[] = value;
      for (let i = 0; i < items.length && !walkEnded(walk); i++) {
        keys.push(i);
        visit(items[i], depth + 1, walk);
        keys.pop();
      }
    } else {
      const names = Object.keys(value);
      for (let i = names.length - 1; i >= 0 && !walkEnded(walk); i--) {
        const name = names[i]!;
        keys.push(name);
        visit((value as Record<string, unknown>)[name], depth + 1, walk);
        keys.pop();
      }
    }
  }
}

/**
 * Guards the schema and rules against documents no JSON text can produce or
 * that are built to hurt: NaN/Infinity, cycles, very deep nesting, huge
 * sizes. Returns issues (at most 20); never throws.
 */
export function hostileValueIssues(doc: unknown): ValidationIssue[] {
  const walk: Walk = { issues: [], nodes: 0, keys: [], stopped: false };
  visit(doc, 0, walk);
  return walk.issues;
}
