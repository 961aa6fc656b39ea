import "server-only";
import type { NextRequest } from "next/server";
import type { Executor } from "@/db/client";
import { listAllBankSigningKeys } from "@/db/bank-signatures";
import { listBuildsByBankSha256, listRegistryVersionsByHashPrefix } from "@/db/dumps";
import { dumpKeys, looksLikeIntelHex, readIntelHex, reportDump, type DumpReport } from "@/lib/engine";
import { verifyWithPem } from "@/lib/signing/ed25519";
import { SIGNATURE_BLOCK_BYTES } from "@/lib/signing/signature-block";
import { AppError } from "@/lib/api/errors";
import { identifyDump, MAX_DUMP_BYTES } from "@/lib/api/operations/support";
import { formFiles, readRawBody } from "@/lib/platform/http/raw-body";

/**
 * Identifies a dump against the registry: looks up the published versions its
 * slots' content labels name and the build whose bank has the image's SHA-256,
 * then reports with the same pure function the command line uses. The signature (a
 * supplied .sig, else the block stored after the CRC, else the matching build's) is
 * checked against every key the registry lists.
 */
export async function identifyDumpBytes(db: Executor, input: { bytes: Uint8Array; fileName: string | null; signature?: Uint8Array }): Promise<DumpReport> {
  let image = input.bytes;
  if (looksLikeIntelHex(image)) image = readIntelHex(new TextDecoder().decode(image)).bytes;
  const keys = dumpKeys(image);
  const [known, builds, signingKeys] = await Promise.all([
    listRegistryVersionsByHashPrefix(db, { prefixes: keys.hashPrefixes }),
    keys.imageSha256 ? listBuildsByBankSha256(db, { sha256: keys.imageSha256 }) : Promise.resolve([]),
    listAllBankSigningKeys(db),
  ]);
  return reportDump({ bytes: input.bytes, fileName: input.fileName, known, builds, signature: { sidecar: input.signature, keys: signingKeys, verify: verifyWithPem } });
}

/**
 * A dump as support uploads it: the raw file (its name in X-File-Name), or a form with the
 * file and optionally its .sig in the field "signature". Refused before identification when
 * empty, larger than any bank (413), or with a signature block of the wrong size (400).
 */
export async function identifyUploadedDump(db: Executor, req: NextRequest): Promise<DumpReport> {
  // Multipart framing adds a little to the file itself.
  const { bytes, contentType } = await readRawBody(req, { maxBytes: MAX_DUMP_BYTES + 4096, contentTypes: identifyDump.rawBody!.contentTypes });
  let file: { name: string | null; bytes: Buffer };
  let signature: Buffer | undefined;
  if (/^multipart\/form-data/i.test(contentType)) {
    const parts = await formFiles(bytes, contentType);
    // A .sig sidecar may come in the field "signature"; the dump is the first other file.
    const part = parts.find((p) => p.field !== "signature");
    if (!part) throw new AppError("bad_request", "The form holds no file; attach the .bin or .hex dump.");
    file = part;
    signature = parts.find((p) => p.field === "signature")?.bytes;
    if (signature && signature.length !== SIGNATURE_BLOCK_BYTES) throw new AppError("bad_request", `The signature file is ${signature.length} bytes; a .sig signature block is ${SIGNATURE_BLOCK_BYTES}. Attach the .sig downloaded with the build.`);
  } else {
    file = { name: req.headers.get("x-file-name"), bytes };
  }
  if (file.bytes.length === 0) throw new AppError("bad_request", "The dump is empty; attach the .bin or .hex file read back from the board.");
  if (file.bytes.length > MAX_DUMP_BYTES) throw new AppError("payload_too_large", `The dump is larger than ${MAX_DUMP_BYTES / 1024} KiB; a profile bank is far smaller.`);
  return identifyDumpBytes(db, { bytes: new Uint8Array(file.bytes), fileName: file.name, ...(signature ? { signature: new Uint8Array(signature) } : {}) });
}
