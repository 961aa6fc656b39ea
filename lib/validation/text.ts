/**
 * Character rules for text that arrives from outside (request bodies, query strings, CSV
 * cells, file names). PostgreSQL text cannot hold U+0000 at all, other C0 controls are
 * invisible and break logs and exports, and the bidirectional override and isolate
 * characters make a name or file name display differently from what it is
 * ("Trojan Source", CVE-2021-42574). Refusing them where the text enters keeps every
 * later layer from having to cope.
 */

// Tab, line feed and carriage return are ordinary in multi-line text (drafts, reasons, CSV).
// eslint-disable-next-line no-control-regex
const CONTROL_RE = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f]/;
// In one-line values (names, query values, path segments) line breaks and tabs are refused too.
// eslint-disable-next-line no-control-regex
const LINE_CONTROL_RE = /[\u0000-\u001f\u007f]/;
/** Unicode bidirectional embedding/override (U+202A–U+202E) and isolate (U+2066–U+2069) controls. */
const BIDI_RE = /[\u202a-\u202e\u2066-\u2069]/;

/** What is wrong with one piece of text, or undefined when it may be stored. */
export function unsafeTextReason(text: string, { singleLine = false }: { singleLine?: boolean } = {}): string | undefined {
  const control = (singleLine ? LINE_CONTROL_RE : CONTROL_RE).exec(text);
  if (control) {
    const code = control[0].charCodeAt(0);
    const name = code === 0 ? "a NUL character (U+0000)" : `the control character U+${code.toString(16).toUpperCase().padStart(4, "0")}`;
    return `The text contains ${name} at position ${control.index + 1}; remove it${singleLine ? " (this value is one line without tabs)" : ""}.`;
  }
  const bidi = BIDI_RE.exec(text);
  if (bidi) {
    const code = bidi[0].charCodeAt(0).toString(16).toUpperCase();
    return `The text contains the invisible direction control U+${code} at position ${bidi.index + 1}, which makes it display differently from what it is; remove it.`;
  }
  return undefined;
}

export interface UnsafeTextIssue {
  /** JSON pointer (RFC 6901) of the value, or of the object holding the offending key. */
  path: string;
  message: string;
}

function pointerSegment(key: string): string {
  return key.replace(/~/g, "~0").replace(/\//g, "~1");
}

/**
 * Walks a parsed JSON value (without recursion, so hostile depth cannot overflow the
 * stack) and reports the first few strings or keys that break the character rules.
 */
export function findUnsafeText(value: unknown, maxIssues = 10): UnsafeTextIssue[] {
  const issues: UnsafeTextIssue[] = [];
  const stack: { value: unknown; path: string }[] = [{ value, path: "" }];
  while (stack.length > 0 && issues.length < maxIssues) {
    const { value: v, path } = stack.pop()!;
    if (typeof v === "string") {
      const reason = unsafeTextReason(v);
      if (reason) issues.push({ path, message: reason });
    } else if (Array.isArray(v)) {
      for (let i = v.length - 1; i >= 0; i--) stack.push({ value: v[i], path: `${path}/${i}` });
    } else if (v && typeof v === "object") {
      for (const [k, child] of Object.entries(v)) {
        const reason = unsafeTextReason(k, { singleLine: true });
        if (reason) issues.push({ path, message: `A property name is not allowed: ${reason}` });
        stack.push({ value: child, path: `${path}/${pointerSegment(k)}` });
      }
    }
  }
  return issues;
}

/**
 * The deepest nesting of arrays and objects in JSON text, counted in one pass over the
 * characters before anything is parsed. Brackets inside strings do not count; text that
 * is not valid JSON still gets a number (the parser reports its errors afterwards).
 * Stops counting once `stopAbove` is passed.
 */
export function jsonNestingDepth(text: string, stopAbove = Number.POSITIVE_INFINITY): number {
  let depth = 0;
  let deepest = 0;
  let inString = false;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (inString) {
      if (c === 0x5c) i++; // backslash: skip the escaped character
      else if (c === 0x22) inString = false;
      continue;
    }
    if (c === 0x22) inString = true;
    else if (c === 0x7b || c === 0x5b) {
      depth++;
      if (depth > deepest) {
        deepest = depth;
        if (deepest > stopAbove) return deepest;
      }
    } else if ((c === 0x7d || c === 0x5d) && depth > 0) depth--;
  }
  return deepest;
}
