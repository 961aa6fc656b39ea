import fs from "node:fs";
import path from "node:path";
import { gzipSync, deflateRawSync } from "node:zlib";
import { afterAll, describe, expect, it } from "vitest";
import { count } from "drizzle-orm";
import { closeDb, getDb } from "./support/db";
import { callRoute, tokenFor } from "./support/http";
import { freshDraftBuild } from "./support/builds";
import { uploads } from "@/db/schema";
import { POST as uploadFirmware } from "@/app/api/v1/uploads/route";
import { POST as uploadEvidence } from "@/app/api/v1/builds/[id]/evidence/route";
import { POST as importProfile } from "@/app/api/v1/profiles/[id]/import/route";
import { POST as createToken } from "@/app/api/v1/tokens/route";

process.env.LOOPKEEPER_LOG = "silent";
afterAll(closeDb);

const storageDir = path.resolve(process.env.STORAGE_DIR ?? ".data/uploads");
const storedFiles = () => (fs.existsSync(storageDir) ? fs.readdirSync(storageDir).length : 0);
const rows = async () => (await getDb().select({ n: count() }).from(uploads))[0]!.n;

/** A minimal one-entry ZIP whose entry inflates to `inflatedBytes` of zeros (APPNOTE 6.3 local header + central directory). */
function zipBomb(inflatedBytes: number): Buffer {
  const data = deflateRawSync(Buffer.alloc(inflatedBytes));
  const name = Buffer.from("report.pdf");
  const local = Buffer.alloc(30);
  local.writeUInt32LE(0x04034b50, 0);
  local.writeUInt16LE(20, 4);
  local.writeUInt16LE(8, 8); // deflate
  local.writeUInt32LE(data.length, 18);
  local.writeUInt32LE(inflatedBytes, 22);
  local.writeUInt16LE(name.length, 26);
  const central = Buffer.alloc(46);
  central.writeUInt32LE(0x02014b50, 0);
  central.writeUInt16LE(20, 6);
  central.writeUInt16LE(8, 10);
  central.writeUInt32LE(data.length, 20);
  central.writeUInt32LE(inflatedBytes, 24);
  central.writeUInt16LE(name.length, 28);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0);
  end.writeUInt16LE(1, 8);
  end.writeUInt16LE(1, 10);
  end.writeUInt32LE(central.length + name.length, 12);
  end.writeUInt32LE(local.length + name.length + data.length, 16);
  return Buffer.concat([local, name, data, central, name, end]);
}

/** A body that keeps coming: `chunks` pieces of `chunkBytes`, counted as they are pulled. */
function endlessBody(chunkBytes: number, chunks: number) {
  let sent = 0;
  const stream = new ReadableStream<Uint8Array>({
    pull(controller) {
      if (sent >= chunks) return controller.close();
      sent++;
      controller.enqueue(new Uint8Array(chunkBytes));
    },
  });
  return { stream, pulled: () => sent };
}

describe("hostile uploads", () => {
  it("a ZIP bomb claimed to be a PDF lab report is refused by its content, and nothing is kept", async () => {
    const token = await tokenFor("release@tarnwell.example");
    const b = await freshDraftBuild();
    const [files, before] = [storedFiles(), await rows()];
    const bomb = zipBomb(50 * 1024 * 1024);
    expect(bomb.length).toBeLessThan(100 * 1024);
    const res = await callRoute(uploadEvidence, { url: `/api/v1/builds/${b.id}/evidence?kind=lab_report&name=report.pdf`, method: "POST", token, params: { id: b.id }, body: new Uint8Array(bomb) });
    expect(res.status).toBe(415);
    expect(storedFiles()).toBe(files);
    expect(await rows()).toBe(before);
  });

  it("a gzip-encoded body is refused before anything is inflated", async () => {
    const token = await tokenFor("engineer@tarnwell.example");
    const gz = gzipSync(Buffer.alloc(64 * 1024 * 1024));
    const [files, before] = [storedFiles(), await rows()];
    const fw = await callRoute(uploadFirmware, { url: "/api/v1/uploads?name=fw.bin", method: "POST", token, body: new Uint8Array(gz), headers: { "content-encoding": "gzip" } });
    expect(fw.status).toBe(415);
    expect(((await fw.json()) as { error: { message: string } }).error.message).toMatch(/Compressed request bodies/);
    const json = await callRoute(createToken, { url: "/api/v1/tokens", method: "POST", token, body: new Uint8Array(gzipSync(JSON.stringify({ name: "x", expiresInDays: 1 }))), headers: { "content-type": "application/json", "content-encoding": "gzip" } });
    expect(json.status).toBe(415);
    expect(storedFiles()).toBe(files);
    expect(await rows()).toBe(before);
  });

  it("a huge body without Content-Length is cut off at the limit while streaming", async () => {
    const token = await tokenFor("engineer@tarnwell.example");
    const profileId = (await getDb().query.profiles.findFirst())!.id;
    const body = endlessBody(64 * 1024, 100_000); // would be 6.4 GB
    const res = await callRoute(importProfile, { url: `/api/v1/profiles/${profileId}/import`, method: "POST", token, params: { id: profileId }, body: body.stream, headers: { "content-type": "application/json" } });
    expect(res.status).toBe(413);
    // Reading stopped right after the limit: a few chunks past 256 KiB, not the whole stream.
    expect(body.pulled()).toBeLessThan(20);
  });
});
