import "server-only";

/** A file to download: its bytes, type and name, the SHA-256 the response states when there is one, and how caches may keep it. */
export interface DownloadFile {
  bytes: Uint8Array | string;
  contentType: string;
  fileName: string;
  sha256?: string;
  /** The Cache-Control header, for files caches on the way must not keep. */
  cacheControl?: string;
}

/** The response that carries a download as an attachment. */
export function downloadResponse(file: DownloadFile): Response {
  const headers: Record<string, string> = { "content-type": file.contentType, "content-disposition": `attachment; filename="${file.fileName}"` };
  if (file.sha256) headers["x-content-sha256"] = file.sha256;
  if (file.cacheControl) headers["cache-control"] = file.cacheControl;
  return new Response(typeof file.bytes === "string" ? file.bytes : Buffer.from(file.bytes), { headers });
}
