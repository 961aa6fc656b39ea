/**
 * What PostgreSQL refused, in storage terms: the one place that reads its error codes. The
 * use cases and the HTTP layer decide what a refusal means to a person (which message,
 * which status); storage only says which guard stopped the write.
 */
export type ConstraintKind = "unique" | "exclusion" | "foreign_key" | "check" | "not_null" | "immutable";

export type StorageFailure =
  | { kind: ConstraintKind; constraint?: string; detail?: string }
  | { kind: "concurrent_change" }
  | { kind: "bad_value" }
  | { kind: "unreachable" };

const CONSTRAINT_CODES: Record<string, ConstraintKind> = {
  "23505": "unique",
  "23P01": "exclusion",
  "23503": "foreign_key",
  "23514": "check",
  "23502": "not_null",
  // Raised by the triggers that keep published rows unchanged.
  "23001": "immutable",
};

const CONNECTION_CODES = new Set(["ECONNREFUSED", "ECONNRESET", "ETIMEDOUT", "EPIPE", "57P01", "57P02", "57P03", "08000", "08001", "08003", "08006"]);

/** The driver's fields; Drizzle wraps driver errors, so they may sit on a cause a few levels down. */
function driverFields(err: unknown): { code?: string; constraint?: string; detail?: string } {
  let e: unknown = err;
  for (let i = 0; i < 4 && e && typeof e === "object"; i++) {
    const o = e as { code?: unknown; constraint?: unknown; detail?: unknown; cause?: unknown };
    if (typeof o.code === "string") {
      return { code: o.code, constraint: typeof o.constraint === "string" ? o.constraint : undefined, detail: typeof o.detail === "string" ? o.detail : undefined };
    }
    e = o.cause;
  }
  return {};
}

/** The storage failure behind `err`, or undefined when it is not one PostgreSQL reported. */
export function storageFailure(err: unknown): StorageFailure | undefined {
  const { code, constraint, detail } = driverFields(err);
  const message = err instanceof Error ? err.message : "";
  if ((code && CONNECTION_CODES.has(code)) || /Connection terminated|connect ECONNREFUSED|timeout exceeded when trying to connect/i.test(message)) return { kind: "unreachable" };
  if (!code) return undefined;
  const kind = CONSTRAINT_CODES[code];
  if (kind) return { kind, constraint, detail };
  if (code === "40001" || code === "40P01") return { kind: "concurrent_change" };
  if (code === "22P02" || code === "22003") return { kind: "bad_value" };
  return undefined;
}

/** Whether `err` is PostgreSQL refusing a write through a guard of this kind (and, when named, this constraint). */
export function isConstraintFailure(err: unknown, kind: ConstraintKind, constraint?: string): boolean {
  const f = storageFailure(err);
  return f !== undefined && f.kind === kind && (constraint === undefined || ("constraint" in f && f.constraint === constraint));
}
