import { randomUUID } from "node:crypto";
import { AppError } from "@/lib/api/errors";

/** What a stored object is known by: a generated key (never a file's name), its size and SHA-256. */
export interface StoredObject {
  key: string;
  sizeBytes: number;
  sha256: string;
}

export interface PutOptions {
  /** The upload is cut off, and nothing kept, as soon as it passes this many bytes. */
  maxBytes: number;
  contentType?: string;
}

export type ByteSource = AsyncIterable<Uint8Array> | ReadableStream<Uint8Array>;

/** One interface for uploaded files; the local-directory and S3 drivers implement it. */
export interface Storage {
  readonly driver: "local" | "s3";
  put(body: ByteSource, options: PutOptions): Promise<StoredObject>;
  get(key: string): Promise<Buffer>;
  delete(key: string): Promise<void>;
}

const KEY_RE = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;

/**
 * The object a key names is not in storage (removed by hand, lost with a volume, expired by
 * a bucket rule) although a row still points at it. Drivers throw this instead of their own
 * "no such file", so callers can say which file is gone instead of failing with a 500.
 */
export class MissingObjectError extends Error {
  constructor(readonly key: string) {
    super(`No stored object under key ${key}.`);
    this.name = "MissingObjectError";
  }
}

export function newKey(): string {
  return randomUUID();
}

/** Keys are generated UUIDs; anything else (a path, "..") is refused before it reaches a driver. */
export function assertKey(key: string): void {
  if (!KEY_RE.test(key)) throw new AppError("bad_request", "Not a storage key.");
}

export function tooLarge(maxBytes: number): AppError {
  return new AppError("payload_too_large", `The file is larger than ${maxBytes} bytes; upload a smaller one.`);
}

async function* iterate(body: ByteSource): AsyncGenerator<Uint8Array> {
  if (Symbol.asyncIterator in body) {
    yield* body as AsyncIterable<Uint8Array>;
    return;
  }
  const reader = (body as ReadableStream<Uint8Array>).getReader();
  try {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) return;
      yield value;
    }
  } finally {
    // Stops the client's upload when we give up early (too large).
    await reader.cancel().catch(() => undefined);
  }
}

/** The chunks of `body`, throwing payload_too_large as soon as the running total passes `maxBytes`. */
export async function* limitedChunks(body: ByteSource, maxBytes: number): AsyncGenerator<Uint8Array> {
  let total = 0;
  for await (const chunk of iterate(body)) {
    total += chunk.byteLength;
    if (total > maxBytes) throw tooLarge(maxBytes);
    yield chunk;
  }
}
