import { apiRoute } from "@/lib/platform/http/api-route";
import { identifyDump, MAX_DUMP_BYTES } from "@/lib/api/operations/support";
import { getDb } from "@/db/client";
import { AppError } from "@/lib/api/errors";
import { firstFormFile, readRawBody } from "@/lib/platform/http/raw-body";
import { identifyDumpBytes } from "@/lib/use-cases/support/identify-dump";

export const POST = apiRoute(identifyDump, async ({ req }) => {
  // Multipart framing adds a little to the file itself.
  const { bytes, contentType } = await readRawBody(req, { maxBytes: MAX_DUMP_BYTES + 4096, contentTypes: identifyDump.rawBody!.contentTypes });
  let file: { name: string | null; bytes: Buffer };
  if (/^multipart\/form-data/i.test(contentType)) {
    const part = await firstFormFile(bytes, contentType);
    if (!part) throw new AppError("bad_request", "The form holds no file; attach the .bin or .hex dump.");
    file = part;
  } else {
    file = { name: req.headers.get("x-file-name"), bytes };
  }
  if (file.bytes.length === 0) throw new AppError("bad_request", "The dump is empty; attach the .bin or .hex file read back from the board.");
  if (file.bytes.length > MAX_DUMP_BYTES) throw new AppError("payload_too_large", `The dump is larger than ${MAX_DUMP_BYTES / 1024} KiB; a profile bank is far smaller.`);
  return identifyDumpBytes(getDb(), { bytes: new Uint8Array(file.bytes), fileName: file.name });
});
