import "server-only";
import type { NextRequest } from "next/server";
import { getDb, type Tx } from "@/db/client";
import { recordAudit, type AuditActor } from "@/db/audit";
import { setEvidenceUpload } from "@/db/build-stages";
import { getBuildRow } from "@/db/builds";
import { AppError } from "@/lib/api/errors";
import { takesEvidence } from "@/lib/release/stages";
import { lockedBuild } from "./locked";
import { acceptUpload, requestBody } from "./uploads";

type Uploader = AuditActor & { userId: string };
type EvidenceKind = "lab_report" | "measurements";

/**
 * Attaches a stored lab report or measurement file to a build, in the transaction that writes
 * the upload row, audited with the file it replaces. Evidence is taken before the pilot run
 * (409 after).
 */
export async function attachEvidence(tx: Tx, actor: Uploader, { buildId, kind, uploadId }: { buildId: string; kind: EvidenceKind; uploadId: string }) {
  const build = await lockedBuild(tx, buildId);
  if (!takesEvidence(build.stage)) throw new AppError("conflict", `Lab evidence is attached before the pilot run; this build is in ${build.stage}.`);
  const column = kind === "lab_report" ? "labReportUploadId" : "measurementsUploadId";
  await setEvidenceUpload(tx, { buildId, kind, uploadId });
  await recordAudit(tx, actor, { action: `build.attach.${kind}`, entityType: "build", entityId: buildId, before: { [column]: build[column] }, after: { [column]: uploadId } });
}

/** A lab report or measurement CSV uploaded for a build: 404 before a byte is read when there is no such build, then stored and attached. */
export async function uploadEvidence(uploader: Uploader, { buildId, kind, name, req }: { buildId: string; kind: EvidenceKind; name: string; req: NextRequest }) {
  if (!(await getBuildRow(getDb(), { id: buildId }))) throw new AppError("not_found", "No build with that id.");
  const upload = await acceptUpload(uploader, { kind, name, body: requestBody(req, kind), attach: (tx, row) => attachEvidence(tx, uploader, { buildId, kind, uploadId: row.id }) });
  return { upload };
}
