import "server-only";
import { AppError } from "@/lib/api/errors";
import { createHash } from "node:crypto";
import { CreateBucketCommand, DeleteObjectCommand, GetObjectCommand, HeadBucketCommand, PutObjectCommand, S3Client } from "@aws-sdk/client-s3";
import { assertKey, limitedChunks, MissingObjectError, newKey, type ByteSource, type PutOptions, type Storage, type StoredObject } from "@/lib/platform/storage/types";

export interface S3Config {
  endpoint?: string;
  bucket: string;
  region: string;
  accessKeyId: string;
  secretAccessKey: string;
}

/**
 * Objects in an S3-compatible bucket. Checksums only when required and path-style URLs:
 * local S3 stand-ins otherwise store aws-chunked framing for streamed bodies.
 */
export function s3Storage(config: S3Config): Storage {
  const client = new S3Client({
    endpoint: config.endpoint,
    region: config.region,
    credentials: { accessKeyId: config.accessKeyId, secretAccessKey: config.secretAccessKey },
    forcePathStyle: true,
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
  });
  let bucketReady: Promise<void> | undefined;
  const ensureBucket = () =>
    (bucketReady ??= client.send(new HeadBucketCommand({ Bucket: config.bucket })).then(
      () => undefined,
      async () => {
        await client.send(new CreateBucketCommand({ Bucket: config.bucket }));
      },
    ).catch((err: unknown) => {
      bucketReady = undefined;
      throw err;
    }));

  const storage: Storage = {
    driver: "s3",
    async put(body: ByteSource, { maxBytes, contentType }: PutOptions): Promise<StoredObject> {
      await ensureBucket();
      // Read with the limit first, so a refused upload never becomes an object.
      const chunks: Uint8Array[] = [];
      const hash = createHash("sha256");
      for await (const chunk of limitedChunks(body, maxBytes)) {
        hash.update(chunk);
        chunks.push(chunk);
      }
      const data = Buffer.concat(chunks);
      const key = newKey();
      await client.send(new PutObjectCommand({ Bucket: config.bucket, Key: key, Body: data, ContentLength: data.length, ContentType: contentType ?? "application/octet-stream" }));
      return { key, sizeBytes: data.length, sha256: hash.digest("hex") };
    },
    async get(key) {
      assertKey(key);
      const res = await client.send(new GetObjectCommand({ Bucket: config.bucket, Key: key })).catch((err: unknown) => {
        const e = err as { name?: string; $metadata?: { httpStatusCode?: number } };
        if (e.name === "NoSuchKey" || e.$metadata?.httpStatusCode === 404) throw new MissingObjectError(key);
        throw err;
      });
      if (!res.Body) return Buffer.alloc(0);
      return Buffer.from(await res.Body.transformToByteArray());
    },
    async delete(key) {
      assertKey(key);
      await client.send(new DeleteObjectCommand({ Bucket: config.bucket, Key: key }));
    },
  };
  return withUnavailableErrors(storage);
}

/**
 * An object store that cannot be reached is the user's "try again later", not an internal
 * error: driver failures other than our own refusals become a 503 that says nothing was kept.
 */
function withUnavailableErrors(storage: Storage): Storage {
  const wrap =
    <A extends unknown[], R>(fn: (...args: A) => Promise<R>) =>
    async (...args: A): Promise<R> => {
      try {
        return await fn(...args);
      } catch (err) {
        if (err instanceof AppError || err instanceof MissingObjectError) throw err;
        throw new AppError("unavailable", "File storage is not reachable right now; nothing was saved. Try again in a moment.", { headers: { "retry-after": "10" } });
      }
    };
  return { ...storage, put: wrap(storage.put.bind(storage)), get: wrap(storage.get.bind(storage)), delete: wrap(storage.delete.bind(storage)) };
}

