import "server-only";
import type { NextRequest } from "next/server";
import { AppError } from "@/lib/api/errors";

/**
 * Refuses compressed request bodies: the app never inflates what a client sends, so a
 * small gzip "bomb" can never grow into gigabytes in memory or on disk.
 */
export function assertIdentityEncoding(req: NextRequest): void {
  const encoding = (req.headers.get("content-encoding") ?? "identity").trim().toLowerCase();
  if (encoding !== "identity" && encoding !== "") {
    throw new AppError("unsupported_media_type", `Compressed request bodies (Content-Encoding: ${encoding}) are not accepted; send the file as it is.`);
  }
}

/**
 * The one capped reader: a request body as bytes, refused (413) as soon as it passes
 * `maxBytes`, whatever Content-Length claims, so an oversize upload never fills memory.
 */
export async function readCappedBody(req: NextRequest, maxBytes: number, tooLargeMessage: string): Promise<Buffer> {
  assertIdentityEncoding(req);
  const tooLarge = () => new AppError("payload_too_large", tooLargeMessage);
  if (Number(req.headers.get("content-length") ?? "0") > maxBytes) throw tooLarge();
  const reader = req.body?.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  if (reader) {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      size += value.byteLength;
      if (size > maxBytes) {
        await reader.cancel();
        throw tooLarge();
      }
      chunks.push(value);
    }
  }
  return Buffer.concat(chunks);
}

/** Reads an upload of one of `contentTypes` as bytes within `maxBytes`. */
export async function readRawBody(req: NextRequest, { maxBytes, contentTypes }: { maxBytes: number; contentTypes: readonly string[] }): Promise<{ bytes: Buffer; contentType: string }> {
  // Keep the header as sent: a multipart boundary is case-sensitive.
  const contentType = req.headers.get("content-type") ?? "";
  const base = contentType.split(";")[0]!.trim().toLowerCase();
  if (!contentTypes.includes(base)) throw new AppError("unsupported_media_type", `Send the file as ${contentTypes.join(", ")}.`);
  const bytes = await readCappedBody(req, maxBytes, `The upload is larger than ${Math.round(maxBytes / 1024)} KiB.`);
  return { bytes, contentType };
}

/** The first file of a multipart/form-data body already read within its limit. */
export async function firstFormFile(bytes: Buffer, contentType: string): Promise<{ name: string; bytes: Buffer } | null> {
  const [first] = await formFiles(bytes, contentType);
  return first ? { name: first.name, bytes: first.bytes } : null;
}

/** Every file of a multipart body, in order, with the form field it came in. */
export async function formFiles(bytes: Buffer, contentType: string): Promise<{ field: string; name: string; bytes: Buffer }[]> {
  let form: FormData;
  try {
    form = await new Response(new Uint8Array(bytes), { headers: { "content-type": contentType } }).formData();
  } catch {
    throw new AppError("bad_request", "The multipart body could not be read; send the file in a form field named file.");
  }
  const out: { field: string; name: string; bytes: Buffer }[] = [];
  for (const [field, value] of form.entries()) {
    if (typeof value !== "string") out.push({ field, name: value.name, bytes: Buffer.from(await value.arrayBuffer()) });
  }
  return out;
}
