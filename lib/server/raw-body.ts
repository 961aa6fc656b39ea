import "server-only";
import type { NextRequest } from "next/server";
import { AppError } from "@/lib/api/errors";

/** Reads a request body as bytes, stopping as soon as it passes `maxBytes` (413), whatever Content-Length claims. */
export async function readRawBody(req: NextRequest, { maxBytes, contentTypes }: { maxBytes: number; contentTypes: readonly string[] }): Promise<{ bytes: Buffer; contentType: string }> {
  // Keep the header as sent: a multipart boundary is case-sensitive.
  const contentType = req.headers.get("content-type") ?? "";
  const base = contentType.split(";")[0]!.trim().toLowerCase();
  if (!contentTypes.includes(base)) throw new AppError("unsupported_media_type", `Send the file as ${contentTypes.join(", ")}.`);
  const declared = Number(req.headers.get("content-length") ?? "0");
  const tooLarge = () => new AppError("payload_too_large", `The upload is larger than ${Math.round(maxBytes / 1024)} KiB.`);
  if (declared > maxBytes) throw tooLarge();
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
  return { bytes: Buffer.concat(chunks), contentType };
}

/** The first file of a multipart/form-data body already read within its limit. */
export async function firstFormFile(bytes: Buffer, contentType: string): Promise<{ name: string; bytes: Buffer } | null> {
  let form: FormData;
  try {
    form = await new Response(new Uint8Array(bytes), { headers: { "content-type": contentType } }).formData();
  } catch {
    throw new AppError("bad_request", "The multipart body could not be read; send the file in a form field named file.");
  }
  for (const value of form.values()) {
    if (typeof value !== "string") return { name: value.name, bytes: Buffer.from(await value.arrayBuffer()) };
  }
  return null;
}
