import "server-only";
import { AppError } from "@/lib/api/errors";
import { constraintIssues } from "@/lib/platform/http/constraint-messages";

const CONNECTION_CODES = new Set(["ECONNREFUSED", "ECONNRESET", "ETIMEDOUT", "EPIPE", "57P01", "57P02", "57P03", "08000", "08001", "08003", "08006"]);

function pgCode(err: unknown): { code?: string; constraint?: string; table?: string } {
  let e: unknown = err;
  // Drizzle wraps driver errors; the PostgreSQL fields live on the cause.
  for (let i = 0; i < 3 && e && typeof e === "object"; i++) {
    const o = e as { code?: unknown; cause?: unknown };
    if (typeof o.code === "string") return o as { code: string };
    e = o.cause;
  }
  return {};
}

const TABLE_WORDS: Record<string, string> = {
  users: "user",
  api_tokens: "API token",
  components: "component",
  board_models: "board model",
  board_revisions: "board revision",
  cooler_models: "cooler model",
  profiles: "profile",
  profile_versions: "profile version",
  builds: "build",
  production_lots: "production lot",
  uploads: "file",
};

function thing(table: string | undefined): string {
  return (table && TABLE_WORDS[table]) ?? "record";
}

/** Turns a database failure into the typed error a user can act on; anything unknown stays internal. */
export function fromDbError(err: unknown): AppError | null {
  if (err instanceof AppError) return err;
  const { code, constraint, table } = pgCode(err);
  const msg = err instanceof Error ? err.message : "";
  if ((code && CONNECTION_CODES.has(code)) || /Connection terminated|connect ECONNREFUSED|timeout exceeded when trying to connect/i.test(msg)) {
    return new AppError("unavailable", "The database is not reachable right now. Try again in a moment.", { headers: { "retry-after": "5" } });
  }
  const known = code?.startsWith("23") ? constraintIssues(constraint) : undefined;
  if (known) return new AppError(code === "23514" ? "validation_failed" : "conflict", known.message, known.issues ? { issues: known.issues } : {});
  // Constraint names, key values and PostgreSQL's own wording stay in the log: a response says in
  // words what clashed, from the table the constraint guards.
  const what = thing(table);
  switch (code) {
    case "23505":
      return new AppError("conflict", `A ${what} with the same name or number already exists; pick a different one.`);
    case "23P01":
      return new AppError("conflict", `This overlaps an existing ${what}; change the range.`);
    case "23503":
      return new AppError("conflict", "This refers to a record that does not exist, or the record is still in use elsewhere.");
    case "23514":
    case "23502":
      return new AppError("validation_failed", "A value is missing or out of its allowed range; check the fields and try again.");
    case "23001":
      return new AppError("conflict", "That record is immutable once published; create a new version instead.");
    case "40001":
    case "40P01":
      return new AppError("conflict", "Someone else changed this at the same moment. Reload and try again.");
    case "22P02":
    case "22003":
    case "22007":
    case "22008":
      return new AppError("bad_request", "A value has the wrong format.");
    case "22021":
    case "22P05":
      return new AppError("bad_request", "The text contains a character that cannot be stored (e.g. a NUL byte); remove it.");
    case "54001":
      return new AppError("validation_failed", "The input is nested too deeply to store; simplify it.");
    default:
      return null;
  }
}
