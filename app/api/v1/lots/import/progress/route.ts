import { apiRoute, errorResponse } from "@/lib/platform/http/api-route";
import { importLotsWithProgress, MAX_LOTS_CSV_BYTES } from "@/lib/api/operations/support";
import { getDb } from "@/db/client";
import { auditActor } from "@/lib/platform/auth/actor";
import { readRawBody } from "@/lib/platform/http/raw-body";
import { ImportCancelled, importLotsCsv } from "@/lib/use-cases/lots/import";
import { IMPORT_PROGRESS_TYPE, type ImportEvent } from "@/lib/lots/import-events";
import type { ErrorBody } from "@/lib/api/errors";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

/**
 * The lots import with its progress: one JSON line per batch of rows, then the result (or the
 * error) as the last line. The client going away (Cancel) stops the import between batches and
 * rolls it back, so a cancelled import records nothing.
 */
export const POST = apiRoute(importLotsWithProgress, async ({ actor, query, req, requestId }) => {
  const { bytes } = await readRawBody(req, { maxBytes: MAX_LOTS_CSV_BYTES, contentTypes: ["text/csv", "text/plain"] });
  const gone = new AbortController();
  req.signal.addEventListener("abort", () => gone.abort(), { once: true });
  const encoder = new TextEncoder();
  const stream = new ReadableStream<Uint8Array>({
    async start(controller) {
      const send = (event: ImportEvent) => {
        if (!gone.signal.aborted) controller.enqueue(encoder.encode(`${JSON.stringify(event)}\n`));
      };
      send({ type: "progress", phase: "parsing", done: 0, total: 0 });
      try {
        const result = await importLotsCsv(getDb(), auditActor(actor, requestId), {
          csv: bytes.toString("utf8"),
          dryRun: query.dryRun !== "false",
          onProgress: (p) => send({ type: "progress", ...p }),
          signal: gone.signal,
        });
        send({ type: "result", result });
      } catch (err) {
        // A cancel has rolled the transaction back and nobody is listening for the answer.
        if (!(err instanceof ImportCancelled)) {
          const failed = errorResponse(err, requestId);
          send({ type: "error", status: failed.status, body: (await failed.json()) as ErrorBody });
        }
      }
      if (!gone.signal.aborted) controller.close();
    },
    cancel() {
      gone.abort();
    },
  });
  return new Response(stream, { status: 200, headers: { "content-type": `${IMPORT_PROGRESS_TYPE}; charset=utf-8`, "cache-control": "no-store" } });
});
