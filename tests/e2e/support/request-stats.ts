import fs from "node:fs";
import path from "node:path";

/** Where scripts/serve.mjs writes one line per request when LOOPKEEPER_REQUEST_STATS is set (playwright.config.ts). */
export function requestStatsFile(port: number): string {
  return path.resolve(".data", `request-stats-${port}.jsonl`);
}

export interface RequestStatsLine {
  requestId: string | null;
  method: string;
  path: string;
  status: number;
  queries: number;
  sessionLookups: number;
  actorQueries: number;
}

/** The line of the request sent with this x-request-id; the server appends it when the answer is complete. */
export async function statsOf(file: string, requestId: string): Promise<RequestStatsLine> {
  for (let i = 0; i < 100; i++) {
    const text = fs.existsSync(file) ? fs.readFileSync(file, "utf8") : "";
    const line = text
      .split("\n")
      .filter(Boolean)
      .map((l) => JSON.parse(l) as RequestStatsLine)
      .find((l) => l.requestId === requestId);
    if (line) return line;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no request-stats line for ${requestId} in ${file}`);
}
