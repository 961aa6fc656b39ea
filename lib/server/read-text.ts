import "server-only";
import type { NextRequest } from "next/server";
import { AppError } from "@/lib/api/errors";

/** Reads a request body as UTF-8 text, stopping at `maxBytes` so a large upload never fills memory. */
export async function readTextBody(req: NextRequest, { maxBytes, contentTypes }: { maxBytes: number; contentTypes: string[] }): Promise<string> {
  const type = (req.headers.get("content-type") ?? "").split(";")[0]!.trim().toLowerCase();
  if (!contentTypes.includes(type)) throw new AppError("unsupported_media_type", `Send the file as ${contentTypes.join(" or ")}.`);
  const limitText = `${Math.round(maxBytes / 1024)} KiB`;
  if (Number(req.headers.get("content-length") ?? "0") > maxBytes) throw new AppError("payload_too_large", `The file is larger than ${limitText}.`);
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
        throw new AppError("payload_too_large", `The file is larger than ${limitText}.`);
      }
      chunks.push(value);
    }
  }
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(Buffer.concat(chunks));
  } catch {
    throw new AppError("bad_request", "The file is not UTF-8 text; save it as UTF-8 JSON.");
  }
}
