import "server-only";
import path from "node:path";
import { env } from "@/lib/platform/env";
import { localStorage } from "@/lib/platform/storage/local";
import { s3Storage } from "@/lib/platform/storage/s3";
import type { Storage } from "@/lib/platform/storage/types";

export type { Storage, StoredObject, PutOptions, ByteSource } from "@/lib/platform/storage/types";
export { localStorage, s3Storage };

const globalForStorage = globalThis as unknown as { loopkeeperStorage?: Storage };

/** The configured driver: a local directory by default (STORAGE_DIR), S3 when STORAGE_DRIVER=s3. */
export function getStorage(): Storage {
  if (!globalForStorage.loopkeeperStorage) {
    const e = env();
    globalForStorage.loopkeeperStorage =
      e.STORAGE_DRIVER === "s3"
        ? s3Storage({ endpoint: e.S3_ENDPOINT, bucket: e.S3_BUCKET, region: e.S3_REGION, accessKeyId: e.S3_ACCESS_KEY_ID, secretAccessKey: e.S3_SECRET_ACCESS_KEY })
        : localStorage(path.resolve(process.cwd(), e.STORAGE_DIR));
  }
  return globalForStorage.loopkeeperStorage;
}
