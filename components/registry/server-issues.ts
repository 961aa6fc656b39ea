import type { FieldValues, Path, UseFormReturn } from "react-hook-form";
import { AppError } from "@/lib/api/errors";

/**
 * Puts the server's field issues (e.g. a name another model already has, or a limit that is
 * fixed once boards shipped) beside the fields they concern, as the client-side ones are.
 */
export function showServerIssues<T extends FieldValues>(form: UseFormReturn<T>, err: unknown) {
  if (!(err instanceof AppError) || !err.issues) return;
  for (const issue of err.issues) {
    const name = issue.path.replace(/^\//, "");
    if (name && name in form.getValues()) form.setError(name as Path<T>, { type: "server", message: issue.message });
  }
}
