import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createHash } from "node:crypto";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import type { AddressInfo } from "node:net";
import S3rver from "s3rver";
import { ListObjectsV2Command, S3Client } from "@aws-sdk/client-s3";
import { count, eq } from "drizzle-orm";
import { closeDb, demoActor, getDb } from "./support/db";
import { chunksOf } from "./support/builds";
import { uploads } from "@/db/schema";
import { localStorage, s3Storage, type Storage } from "@/lib/platform/storage";
import { acceptUpload } from "@/lib/use-cases/builds/uploads";
import { AppError } from "@/lib/api/errors";
import { tinyPdf } from "@/db/seed/builds";
import { UPLOAD_MAX_BYTES } from "@/lib/release/upload-check";
import { writeIntelHex } from "@/lib/engine";

afterAll(closeDb);

const sha256 = (b: Uint8Array) => createHash("sha256").update(b).digest("hex");

interface Driver {
  name: string;
  storage: () => Storage;
  /** Keys the backend holds right now. */
  keys: () => Promise<string[]>;
}

const localDir = fs.mkdtempSync(path.join(os.tmpdir(), "lk-local-"));
const s3Dir = fs.mkdtempSync(path.join(os.tmpdir(), "lk-s3-"));
let s3rver: S3rver;
let s3Endpoint = "";
const BUCKET = "loopkeeper-test";

beforeAll(async () => {
  s3rver = new S3rver({ address: "127.0.0.1", port: 0, silent: true, directory: s3Dir });
  const addr: AddressInfo = await s3rver.run();
  s3Endpoint = `http://127.0.0.1:${addr.port}`;
});

afterAll(async () => {
  await s3rver?.close();
  fs.rmSync(localDir, { recursive: true, force: true });
  fs.rmSync(s3Dir, { recursive: true, force: true });
});

const s3Config = () => ({ endpoint: s3Endpoint, bucket: BUCKET, region: "us-east-1", accessKeyId: "S3RVER", secretAccessKey: "S3RVER" });

const drivers: Driver[] = [
  { name: "local directory", storage: () => localStorage(localDir), keys: async () => fs.readdirSync(localDir) },
  {
    name: "S3 (s3rver)",
    storage: () => s3Storage(s3Config()),
    keys: async () => {
      const client = new S3Client({ endpoint: s3Endpoint, region: "us-east-1", credentials: { accessKeyId: "S3RVER", secretAccessKey: "S3RVER" }, forcePathStyle: true });
      const res = await client.send(new ListObjectsV2Command({ Bucket: BUCKET })).catch(() => ({ Contents: [] }));
      return (res.Contents ?? []).map((o) => o.Key ?? "");
    },
  },
];

async function uploadRows() {
  const [r] = await getDb().select({ n: count() }).from(uploads);
  return r!.n;
}

describe.each(drivers)("storage driver: $name", (driver) => {
  it("stores streamed bytes under a generated key with their size and SHA-256, and reads them back intact", async () => {
    const storage = driver.storage();
    const bytes = new Uint8Array(200_000).map((_, i) => (i * 31 + 7) & 0xff);
    const obj = await storage.put(chunksOf(bytes, 7_000), { maxBytes: 1_000_000 });
    expect(obj.key).toMatch(/^[0-9a-f-]{36}$/);
    expect(obj.sizeBytes).toBe(bytes.length);
    // SHA-256 of the same bytes from Node's own implementation (FIPS 180-4).
    expect(obj.sha256).toBe(sha256(bytes));
    const back = await storage.get(obj.key);
    expect(sha256(back)).toBe(obj.sha256);
    await storage.delete(obj.key);
    expect(await driver.keys()).not.toContain(obj.key);
  });

  it("cuts an upload off at the size limit while streaming and keeps nothing", async () => {
    const storage = driver.storage();
    const before = await driver.keys();
    let produced = 0;
    async function* endless() {
      for (;;) {
        produced += 4096;
        yield new Uint8Array(4096);
        if (produced > 10_000_000) return;
      }
    }
    const err = await storage.put(endless(), { maxBytes: 50_000 }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(AppError);
    expect((err as AppError).status).toBe(413);
    // Stopped reading soon after the limit, not at the end of the stream.
    expect(produced).toBeLessThan(60_000);
    expect(await driver.keys()).toEqual(before);
  });

  it("refuses keys that are paths", async () => {
    const storage = driver.storage();
    await expect(storage.get("../../etc/passwd")).rejects.toThrow(/storage key/);
    await expect(storage.delete("../x")).rejects.toThrow(/storage key/);
  });

  describe("uploads through the storage", () => {
    const refusals: { what: string; kind: "firmware" | "lab_report" | "measurements"; name: string; bytes: () => Uint8Array; status: number }[] = [
      { what: "a firmware image over the limit", kind: "firmware", name: "fw.bin", bytes: () => new Uint8Array(UPLOAD_MAX_BYTES.firmware + 1), status: 413 },
      { what: "a lab report that is not a PDF", kind: "lab_report", name: "report.pdf", bytes: () => new TextEncoder().encode("<html>not a pdf</html>"), status: 415 },
      { what: "a CSV without the measurement header", kind: "measurements", name: "m.csv", bytes: () => new TextEncoder().encode("a,b,c\n1,2,3\n"), status: 415 },
      { what: "Intel HEX with a bad checksum", kind: "firmware", name: "fw.hex", bytes: () => new TextEncoder().encode(":0400000001020304F0\n:00000001FF\n"), status: 415 },
      { what: "a hostile name", kind: "lab_report", name: "../../etc/passwd", bytes: () => tinyPdf("x"), status: 422 },
      { what: "a name with a folder", kind: "firmware", name: "C:\\fw\\x.bin", bytes: () => new Uint8Array([1, 2, 3]), status: 422 },
    ];
    for (const r of refusals) {
      it(`refuses ${r.what} and stores nothing`, async () => {
        const who = await demoActor("release@tarnwell.example");
        const keysBefore = await driver.keys();
        const rowsBefore = await uploadRows();
        const err = await acceptUpload(who, { kind: r.kind, name: r.name, body: chunksOf(r.bytes()) }, driver.storage()).catch((e: unknown) => e);
        expect(err).toBeInstanceOf(AppError);
        expect((err as AppError).status).toBe(r.status);
        expect(await driver.keys()).toEqual(keysBefore);
        expect(await uploadRows()).toBe(rowsBefore);
      });
    }

    it("accepts a PDF, a measurement CSV and an Intel HEX firmware, recording their SHA-256", async () => {
      const who = await demoActor("release@tarnwell.example");
      const hex = new TextEncoder().encode(writeIntelHex(new Uint8Array([1, 2, 3, 4, 5]), 0x0800f000));
      const files = [
        { kind: "lab_report" as const, name: "report.pdf", bytes: new Uint8Array(tinyPdf("ok")), type: "application/pdf" },
        { kind: "measurements" as const, name: "m.csv", bytes: new TextEncoder().encode("liquid_temp_c,pump_rpm,fan_rpm,sound_dba\n40,2000,1200,30.5\n"), type: "text/csv" },
        { kind: "firmware" as const, name: "fw.hex", bytes: hex, type: "text/x-hex" },
      ];
      for (const f of files) {
        const row = await acceptUpload(who, { kind: f.kind, name: f.name, body: chunksOf(f.bytes) }, driver.storage());
        expect(row.contentType).toBe(f.type);
        expect(row.sha256).toBe(sha256(f.bytes));
        const [stored] = await getDb().select().from(uploads).where(eq(uploads.id, row.id));
        expect(await driver.keys()).toContain(stored!.storageKey);
        expect(stored!.storageKey).not.toContain(f.name);
      }
    });
  });
});
