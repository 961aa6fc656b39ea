import { apiRoute } from "@/lib/platform/http/api-route";
import { importLots as importLotsOp, MAX_LOTS_CSV_BYTES, type ImportResult } from "@/lib/api/operations/support";
import { getDb } from "@/db/client";
import { importLots } from "@/db/lots";
import { auditActor } from "@/lib/platform/auth/actor";
import { readRawBody } from "@/lib/platform/http/raw-body";
import { parseLotsCsv } from "@/lib/lots/csv";

export const POST = apiRoute(importLotsOp, async ({ actor, query, req, requestId }): Promise<ImportResult> => {
  const dryRun = query.dryRun !== "false";
  const { bytes } = await readRawBody(req, { maxBytes: MAX_LOTS_CSV_BYTES, contentTypes: ["text/csv", "text/plain"] });
  const parsed = parseLotsCsv(bytes.toString("utf8"));
  // Rows with format errors stop the import before the database is asked anything.
  if (parsed.issues.length) return { dryRun, checked: parsed.rows.length, committed: 0, issues: parsed.issues };
  const r = await importLots(getDb(), auditActor(actor, requestId), { rows: parsed.rows, dryRun });
  return { dryRun, ...r };
});
