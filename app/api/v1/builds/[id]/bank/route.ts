import { apiRoute } from "@/lib/platform/http/api-route";
import { downloadBank } from "@/lib/api/operations/builds";
import { getDb } from "@/db/client";
import { listRevisionsOfModel } from "@/db/boards";
import { getBuildImage } from "@/db/builds";
import { AppError } from "@/lib/api/errors";
import { satisfiesRange, sha256, toHex, writeIntelHex } from "@/lib/engine";
import { formatSignatureBlock } from "@/lib/signing/signature-block";

export const GET = apiRoute(downloadBank, async ({ params, query }) => {
  const db = getDb();
  const build = await getBuildImage(db, { id: params.id });
  if (!build?.bankImage) throw new AppError("not_found", "No build with that id, or it has no bank image.");
  const base = `bank-${build.version}`;
  if (query.format === "sig") {
    if (!build.bankSignature || !build.bankSignatureKeyId) throw new AppError("not_found", "This build's bank is not signed yet; banks are signed when the build enters pilot.");
    const block = formatSignatureBlock({ keyId: build.bankSignatureKeyId, signature: new Uint8Array(build.bankSignature) });
    return new Response(Buffer.from(block), { headers: { "content-type": "application/octet-stream", "content-disposition": `attachment; filename="${base}.sig"` } });
  }
  if (query.format === "bin") {
    return new Response(Buffer.from(build.bankImage), {
      headers: { "content-type": "application/octet-stream", "content-disposition": `attachment; filename="${base}.bin"`, "x-content-sha256": toHex(sha256(build.bankImage)) },
    });
  }
  const revisions = (await listRevisionsOfModel(db, { boardModelId: build.boardModelId })).filter((r) => satisfiesRange(r.revision, build.revisionRange));
  const revision = query.revision ? revisions.find((r) => r.revision === query.revision) : revisions[0];
  if (!revision) throw new AppError("not_found", query.revision ? `Revision ${query.revision} is not in this build's range.` : "No board revision is in this build's range.");
  const text = writeIntelHex(build.bankImage, revision.baseAddress);
  const bytes = new TextEncoder().encode(text);
  return new Response(bytes, {
    headers: { "content-type": "text/plain; charset=us-ascii", "content-disposition": `attachment; filename="${base}-rev${revision.revision}.hex"`, "x-content-sha256": toHex(sha256(bytes)) },
  });
});
