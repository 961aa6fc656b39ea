import "server-only";
import type { Executor } from "@/db/client";
import { listRevisionsOfModel } from "@/db/boards";
import { getBuildImage } from "@/db/builds";
import { AppError } from "@/lib/api/errors";
import { satisfiesRange, sha256, toHex, writeIntelHex } from "@/lib/engine";
import { bankVectors, vectorsJson } from "@/lib/firmware";
import { formatSignatureBlock } from "@/lib/signing/signature-block";
import type { DownloadFile } from "@/lib/platform/http/download";


async function storedBank(db: Executor, id: string) {
  const build = await getBuildImage(db, { id });
  if (!build?.bankImage) throw new AppError("not_found", "No build with that id, or it has no bank image.");
  return { ...build, bankImage: build.bankImage };
}

/**
 * A build's bank as the factory flashes it: the raw image (.bin), its detached signature
 * (.sig, once signed at pilot), or Intel HEX at the base address of one board revision in the
 * build's range (the first, in semver order, unless one is named).
 */
export async function bankFile(db: Executor, { id, format, revision: wanted }: { id: string; format?: "bin" | "hex" | "sig"; revision?: string }): Promise<DownloadFile> {
  const build = await storedBank(db, id);
  const base = `bank-${build.version}`;
  if (format === "sig") {
    if (!build.bankSignature || !build.bankSignatureKeyId) throw new AppError("not_found", "This build's bank is not signed yet; banks are signed when the build enters pilot.");
    return { bytes: formatSignatureBlock({ keyId: build.bankSignatureKeyId, signature: new Uint8Array(build.bankSignature) }), contentType: "application/octet-stream", fileName: `${base}.sig` };
  }
  if (format === "bin") return { bytes: build.bankImage, contentType: "application/octet-stream", fileName: `${base}.bin`, sha256: toHex(sha256(build.bankImage)) };
  const revisions = (await listRevisionsOfModel(db, { boardModelId: build.boardModelId })).filter((r) => satisfiesRange(r.revision, build.revisionRange));
  const revision = wanted ? revisions.find((r) => r.revision === wanted) : revisions[0];
  if (!revision) throw new AppError("not_found", wanted ? `Revision ${wanted} is not in this build's range.` : "No board revision is in this build's range.");
  const bytes = new TextEncoder().encode(writeIntelHex(build.bankImage, revision.baseAddress));
  return { bytes, contentType: "text/plain; charset=us-ascii", fileName: `${base}-rev${revision.revision}.hex`, sha256: toHex(sha256(bytes)) };
}

/** Test vectors for firmware, decoded from the stored bank bytes, so they describe exactly the image the factory flashes (409 when it does not decode). */
export async function vectorsFile(db: Executor, { id }: { id: string }): Promise<DownloadFile> {
  const build = await storedBank(db, id);
  const result = bankVectors(new Uint8Array(build.bankImage));
  if (!result.ok) throw new AppError("conflict", `The stored bank image of this build does not decode (${result.errors[0]?.message ?? "unreadable"}); it cannot have vectors.`);
  const bytes = new TextEncoder().encode(vectorsJson(result.vectors));
  return { bytes, contentType: "application/json; charset=utf-8", fileName: `vectors-${build.version}.json`, sha256: toHex(sha256(bytes)) };
}
