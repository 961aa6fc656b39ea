import type { TextRange } from "./positions";

export type IssueSeverity = "error" | "warning";

/** One finding of validation. */
export interface ValidationIssue {
  /** Stable code, e.g. "curve.temps_not_increasing"; safe to match on. */
  code: string;
  /** JSON pointer (RFC 6901) of the value concerned; "" for the whole document. */
  path: string;
  severity: IssueSeverity;
  /** What is wrong and how to fix it. */
  message: string;
  /** Where in the text, when validating text. */
  range?: TextRange;
}

export interface ValidationResult<T> {
  /** True when no issue has severity "error" (warnings allowed). */
  ok: boolean;
  issues: ValidationIssue[];
  /** The document, typed, when it passed the schema (semantic errors may remain). */
  value?: T;
}
