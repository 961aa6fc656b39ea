import { apiRoute } from "@/lib/platform/http/api-route";
import { importLots, MAX_LOTS_CSV_BYTES, type ImportResult } from "@/lib/api/operations/support";
import { getDb } from "@/db/client";
import { auditActor } from "@/lib/platform/auth/actor";
import { readRawBody } from "@/lib/platform/http/raw-body";
import { importLotsCsv } from "@/lib/use-cases/lots/import";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const POST = apiRoute(importLots, async ({ actor, query, req, requestId }): Promise<ImportResult> => {
  const { bytes } = await readRawBody(req, { maxBytes: MAX_LOTS_CSV_BYTES, contentTypes: ["text/csv", "text/plain"] });
  return importLotsCsv(getDb(), auditActor(actor, requestId), { csv: bytes.toString("utf8"), dryRun: query.dryRun !== "false" });
});
