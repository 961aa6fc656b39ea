import "server-only";
import { createHash } from "node:crypto";
import { createWriteStream } from "node:fs";
import fs from "node:fs/promises";
import path from "node:path";
import { once } from "node:events";
import { assertKey, limitedChunks, MissingObjectError, newKey, type ByteSource, type PutOptions, type Storage, type StoredObject } from "@/lib/platform/storage/types";

/** Files in one local directory, named by generated keys; the default driver. */
export function localStorage(dir: string): Storage {
  const root = path.resolve(dir);
  const fileOf = (key: string) => {
    assertKey(key);
    return path.join(root, key);
  };
  return {
    driver: "local",
    async put(body: ByteSource, { maxBytes }: PutOptions): Promise<StoredObject> {
      await fs.mkdir(root, { recursive: true });
      const key = newKey();
      const file = fileOf(key);
      const hash = createHash("sha256");
      const out = createWriteStream(file, { flags: "wx", mode: 0o600 });
      let sizeBytes = 0;
      try {
        for await (const chunk of limitedChunks(body, maxBytes)) {
          hash.update(chunk);
          sizeBytes += chunk.byteLength;
          if (!out.write(chunk)) await once(out, "drain");
        }
        out.end();
        await once(out, "finish");
      } catch (err) {
        // The file may still be opening (a body refused at its first chunk): removing it before
        // the open has finished would let the open create it afterwards, an empty file no row
        // names and no sweep removes. So the stream is closed first, then the file removed.
        out.on("error", () => undefined); // the request already fails with `err`
        await new Promise<void>((resolve) => {
          if (out.closed) return resolve();
          out.once("close", () => resolve());
          out.destroy();
        });
        await fs.rm(file, { force: true });
        throw err;
      }
      return { key, sizeBytes, sha256: hash.digest("hex") };
    },
    async get(key) {
      try {
        return await fs.readFile(fileOf(key));
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code === "ENOENT") throw new MissingObjectError(key);
        throw err;
      }
    },
    async delete(key) {
      await fs.rm(fileOf(key), { force: true });
    },
  };
}
