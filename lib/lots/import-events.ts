import type { ErrorBody } from "../api/errors";
import type { CsvRowIssue } from "./csv";

/** Media type a client asks for to hear a lots import's progress: one JSON object per line. */
export const IMPORT_PROGRESS_TYPE = "application/x-ndjson";

/** One line of a lots import's progress stream; the last line is the result or the error. */
export type ImportEvent =
  | { type: "progress"; phase: "parsing" | "checking" | "writing"; done: number; total: number }
  | { type: "result"; result: { dryRun: boolean; checked: number; committed: number; issues: CsvRowIssue[] } }
  | { type: "error"; status: number; body: ErrorBody };

/** Parses the complete lines received so far; a trailing partial line waits for the next call. */
export function importEventsIn(textSoFar: string): ImportEvent[] {
  const complete = textSoFar.slice(0, textSoFar.lastIndexOf("\n") + 1);
  return complete
    .split("\n")
    .filter((line) => line.trim() !== "")
    .map((line) => JSON.parse(line) as ImportEvent);
}

/** Percent of the whole import a progress line stands for: checking rows is most of a preview; writing follows on a commit. */
export function importPercent(e: Extract<ImportEvent, { type: "progress" }>, dryRun: boolean): number {
  const part = e.total > 0 ? e.done / e.total : 1;
  if (e.phase === "parsing") return 0;
  if (dryRun || e.phase === "checking") return Math.round((dryRun ? 100 : 50) * part);
  return 50 + Math.round(50 * part);
}
