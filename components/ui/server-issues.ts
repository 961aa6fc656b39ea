import type { FieldValues, Path, UseFormReturn } from "react-hook-form";
import { AppError } from "@/lib/api/errors";
import { issueField } from "./error-notice";

/**
 * Puts the server's field issues (a name another model already has, a limit that is fixed
 * once boards shipped, a serial range that overlaps) beside the fields they concern, as the
 * client-side ones are. Pair it with `<ErrorNotice error={…} besideFields={fieldsOf(form)} />`,
 * which lists only the reasons no field shows.
 */
export function showServerIssues<T extends FieldValues>(form: UseFormReturn<T>, err: unknown): void {
  if (!(err instanceof AppError) || !err.issues) return;
  const fields = fieldsOf(form);
  // Several reasons for one field (a build's slots that do not fit) are all shown beside it.
  const byField = new Map<string, string[]>();
  for (const issue of err.issues) {
    const name = issueField(issue);
    if (name && fields.includes(name)) byField.set(name, [...(byField.get(name) ?? []), issue.message]);
  }
  for (const [name, messages] of byField) form.setError(name as Path<T>, { type: "server", message: messages.join(" ") });
}

/** The names of a form's registered fields, so a notice can leave out what the fields show. */
export function fieldsOf<T extends FieldValues>(form: UseFormReturn<T>): string[] {
  return Object.keys(form.getValues());
}
