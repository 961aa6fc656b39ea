import type { ReactNode } from "react";
import { AppError, type FieldIssue } from "@/lib/api/errors";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";

/** A thrown value as the AppError the API client always throws; anything else becomes a generic fault. */
export function asAppError(error: unknown): AppError {
  if (error instanceof AppError) return error;
  return new AppError("internal", error instanceof Error && error.message ? error.message : "Something went wrong. Try again.");
}

/** The form field a server issue names: "/name" → "name", "/slots/2" → "slots". */
export function issueField(issue: FieldIssue): string {
  return issue.path.replace(/^\//, "").split("/")[0] ?? "";
}

/**
 * The one way a screen shows a refusal or a failed load: the server's message as the title,
 * then every reason it gave that is not already shown beside its form field (`besideFields`
 * names the fields whose issues the form places itself), and a Retry button when the action
 * can simply be tried again.
 */
export function ErrorNotice({
  error,
  besideFields = [],
  onRetry,
  children,
}: {
  error: unknown;
  besideFields?: readonly string[];
  onRetry?: () => void;
  children?: ReactNode;
}) {
  if (!error) return null;
  const e = asAppError(error);
  const listed = (e.issues ?? []).filter((i) => !besideFields.includes(issueField(i)));
  // A lone issue that merely repeats the title adds nothing.
  const reasons = listed.length === 1 && listed[0]?.message === e.message ? [] : listed;
  return (
    <Notice tone="fault" role="alert" title={e.message}>
      {reasons.length > 0 && (
        <ul className="list-disc pl-5" data-testid="error-reasons">
          {reasons.map((i, n) => (
            <li key={n}>
              {i.path && <code className="text-xs">{i.path}</code>} {i.message}
            </li>
          ))}
        </ul>
      )}
      {children}
      {onRetry && (
        <Button variant="secondary" className="mt-1" onClick={onRetry}>
          Retry
        </Button>
      )}
    </Notice>
  );
}
