import { apiRoute } from "@/lib/platform/http/api-route";
import { identifyDump, MAX_DUMP_BYTES } from "@/lib/api/operations/support";
import { getDb } from "@/db/client";
import { AppError } from "@/lib/api/errors";
import { formFiles, readRawBody } from "@/lib/platform/http/raw-body";
import { SIGNATURE_BLOCK_BYTES } from "@/lib/signing/signature-block";
import { identifyDumpBytes } from "@/lib/use-cases/support/identify-dump";

export const POST = apiRoute(identifyDump, async ({ req }) => {
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
  return identifyDumpBytes(getDb(), { bytes: new Uint8Array(file.bytes), fileName: file.name, ...(signature ? { signature: new Uint8Array(signature) } : {}) });
});
