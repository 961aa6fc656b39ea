import type { AppError } from "@/lib/api/errors";
import { Notice } from "@/components/ui/notice";

/** A refusal from the server: its message, and every reason when there are several. */
export function ErrorNotice({ error }: { error: AppError | null }) {
  if (!error) return null;
  const e = error;
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
