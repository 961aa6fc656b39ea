import "server-only";
import type { NextRequest } from "next/server";
import { AppError } from "@/lib/api/errors";
import { readCappedBody } from "@/lib/platform/http/raw-body";

/** Reads a request body as UTF-8 text, stopping at `maxBytes` so a large upload never fills memory. */
export async function readTextBody(req: NextRequest, { maxBytes, contentTypes }: { maxBytes: number; contentTypes: string[] }): Promise<string> {
  const type = (req.headers.get("content-type") ?? "").split(";")[0]!.trim().toLowerCase();
  if (!contentTypes.includes(type)) throw new AppError("unsupported_media_type", `Send the file as ${contentTypes.join(" or ")}.`);
  const bytes = await readCappedBody(req, maxBytes, `The file is larger than ${Math.round(maxBytes / 1024)} KiB.`);
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    throw new AppError("bad_request", "The file is not UTF-8 text; save it as UTF-8 JSON.");
  }
}
