import type { AppError } from "@/lib/api/errors";
import { Notice } from "@/components/ui/notice";

/** A refusal from the server: its message, and every reason when there are several. */
export function ErrorNotice({ error }: { error: unknown }) {
  if (!error) return null;
  const e = error as AppError;
  return (
    <Notice tone="fault" role="alert" title={e.message}>
      {e.issues && e.issues.length > 1 && (
        <ul className="list-disc pl-5">
          {e.issues.map((i, n) => <li key={n}>{i.message}</li>)}
        </ul>
      )}
    </Notice>
  );
}
