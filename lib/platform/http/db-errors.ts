import "server-only";
import { storageFailure } from "@/db/errors";
import { AppError } from "@/lib/api/errors";
import { constraintIssues } from "@/lib/platform/http/constraint-messages";

/**
 * Turns what storage refused into the typed error a user can act on: a named constraint's
 * own message and field when it has one, otherwise a plain sentence per kind of guard.
 * Anything unknown stays internal (logged, answered without detail).
 */
export function fromDbError(err: unknown): AppError | null {
  if (err instanceof AppError) return err;
  const failure = storageFailure(err);
  if (!failure) return null;
  switch (failure.kind) {
    case "unreachable":
      return new AppError("unavailable", "The database is not reachable right now. Try again in a moment.", { headers: { "retry-after": "5" } });
    case "concurrent_change":
      return new AppError("conflict", "Someone else changed this at the same moment. Reload and try again.");
    case "bad_value":
      return new AppError("bad_request", "A value has the wrong format.");
    case "immutable":
      return new AppError("conflict", "That record is immutable once published; create a new version instead.");
    default: {
      const known = constraintIssues(failure.constraint);
      const code = failure.kind === "check" || failure.kind === "not_null" ? "validation_failed" : "conflict";
      if (known) return new AppError(code, known.message, known.issues ? { issues: known.issues } : {});
      // Constraint names and PostgreSQL's detail are not repeated: they describe tables, not what to fix.
      const generic = {
        unique: "That already exists; change the value that must be unique and try again.",
        exclusion: "That overlaps an existing record; change the range and try again.",
        foreign_key: "That refers to something that does not exist or is still in use.",
        check: "A value is out of its allowed range.",
        not_null: "A required value is missing.",
      }[failure.kind];
      return new AppError(code, generic);
    }
  }
}
