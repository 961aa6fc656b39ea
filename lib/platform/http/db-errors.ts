import "server-only";
import { AppError } from "@/lib/api/errors";
import { constraintIssues } from "@/lib/platform/http/constraint-messages";

const CONNECTION_CODES = new Set(["ECONNREFUSED", "ECONNRESET", "ETIMEDOUT", "EPIPE", "57P01", "57P02", "57P03", "08000", "08001", "08003", "08006"]);

function pgCode(err: unknown): { code?: string; constraint?: string; detail?: string; message?: string } {
  let e: unknown = err;
  // Drizzle wraps driver errors; the PostgreSQL fields live on the cause.
  for (let i = 0; i < 3 && e && typeof e === "object"; i++) {
    const o = e as { code?: unknown; cause?: unknown };
    if (typeof o.code === "string") return o as { code: string };
    e = o.cause;
  }
  return {};
}

/** Turns a database failure into the typed error a user can act on; anything unknown stays internal. */
export function fromDbError(err: unknown): AppError | null {
  if (err instanceof AppError) return err;
  const { code, constraint, detail } = pgCode(err);
  const msg = err instanceof Error ? err.message : "";
  if ((code && CONNECTION_CODES.has(code)) || /Connection terminated|connect ECONNREFUSED|timeout exceeded when trying to connect/i.test(msg)) {
    return new AppError("unavailable", "The database is not reachable right now. Try again in a moment.", { headers: { "retry-after": "5" } });
  }
  const known = code?.startsWith("23") ? constraintIssues(constraint) : undefined;
  if (known) return new AppError(code === "23514" ? "validation_failed" : "conflict", known.message, known.issues ? { issues: known.issues } : {});
  switch (code) {
    case "23505":
      return new AppError("conflict", `That already exists (${constraint ?? "unique value"}).${detail ? " " + detail : ""}`);
    case "23P01":
      return new AppError("conflict", `That overlaps an existing record (${constraint ?? "exclusion"}).`);
    case "23503":
      return new AppError("conflict", `That refers to something that does not exist or is still in use (${constraint ?? "reference"}).`);
    case "23514":
      return new AppError("validation_failed", `A value is out of its allowed range (${constraint ?? "check"}).`);
    case "23001":
      return new AppError("conflict", "That record is immutable once published; create a new version instead.");
    case "40001":
    case "40P01":
      return new AppError("conflict", "Someone else changed this at the same moment. Reload and try again.");
    case "22P02":
    case "22003":
      return new AppError("bad_request", "A value has the wrong format.");
    default:
      return null;
  }
}
