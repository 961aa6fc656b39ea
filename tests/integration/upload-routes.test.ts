import { afterAll, describe, expect, it } from "vitest";
import fs from "node:fs";
import path from "node:path";
import { count, eq } from "drizzle-orm";
import { closeDb, getDb } from "./support/db";
import { callRoute, tokenFor } from "./support/http";
import { freshDraftBuild } from "./support/builds";
import { uploads } from "@/db/schema";
import { POST as uploadFirmware } from "@/app/api/v1/uploads/route";
import { POST as uploadEvidence } from "@/app/api/v1/builds/[id]/evidence/route";
import { GET as downloadUpload } from "@/app/api/v1/uploads/[id]/route";
import { GET as downloadBank } from "@/app/api/v1/builds/[id]/bank/route";
import { readIntelHex } from "@/lib/engine";

process.env.LOOPKEEPER_LOG = "silent";
afterAll(closeDb);

const storageDir = path.resolve(process.env.STORAGE_DIR ?? ".data/uploads");
const storedFiles = () => (fs.existsSync(storageDir) ? fs.readdirSync(storageDir).length : 0);
const rows = async () => (await getDb().select({ n: count() }).from(uploads))[0]!.n;

describe("upload and download routes", () => {
  it("refuses hostile names, wrong types and oversize bodies over HTTP, storing nothing", async () => {
    const token = await tokenFor("release@tarnwell.example");
    const b = await freshDraftBuild();
    const filesBefore = storedFiles();
    const rowsBefore = await rows();
    const hostile = await callRoute(uploadEvidence, { url: `/api/v1/builds/${b.id}/evidence?kind=lab_report&name=${encodeURIComponent("../../etc/passwd")}`, method: "POST", token, params: { id: b.id }, body: "%PDF-1.4\n" });
    expect(hostile.status).toBe(422);
    const wrongType = await callRoute(uploadEvidence, { url: `/api/v1/builds/${b.id}/evidence?kind=lab_report&name=report.pdf`, method: "POST", token, params: { id: b.id }, body: "MZ\u0090\u0000 not a pdf" });
    expect(wrongType.status).toBe(415);
    expect(((await wrongType.json()) as { error: { message: string } }).error.message).toMatch(/PDF/);
    const big = await callRoute(uploadFirmware, { url: "/api/v1/uploads?name=fw.bin", method: "POST", token, body: new Uint8Array(3 * 1024 * 1024) });
    expect(big.status).toBe(413);
    expect(storedFiles()).toBe(filesBefore);
    expect(await rows()).toBe(rowsBefore);
  });

  it("stores a firmware image and serves it back with its SHA-256; serves the bank as Intel HEX at the base address", async () => {
    const token = await tokenFor("engineer@tarnwell.example");
    const bytes = new Uint8Array(1000).map((_, i) => i % 251);
    const res = await callRoute(uploadFirmware, { url: "/api/v1/uploads?name=fw.bin", method: "POST", token, body: bytes });
    expect(res.status).toBe(201);
    const { upload } = (await res.json()) as { upload: { id: string; sha256: string } };
    const down = await callRoute(downloadUpload, { url: `/api/v1/uploads/${upload.id}`, token, params: { id: upload.id } });
    expect(down.headers.get("x-content-sha256")).toBe(upload.sha256);
    expect(new Uint8Array(await down.arrayBuffer())).toEqual(bytes);

    const b = await freshDraftBuild();
    const bin = new Uint8Array(await (await callRoute(downloadBank, { url: `/api/v1/builds/${b.id}/bank?format=bin`, token, params: { id: b.id } })).arrayBuffer());
    const hex = await callRoute(downloadBank, { url: `/api/v1/builds/${b.id}/bank?format=hex&revision=2.0.0`, token, params: { id: b.id } });
    const parsed = readIntelHex(await hex.text());
    expect(parsed.ok).toBe(true);
    // Revision 2.0.0 of the demo board keeps its profiles at 0x0801F800.
    expect(parsed.startAddress).toBe(0x0801f800);
    expect(parsed.bytes).toEqual(bin);
  });

  it("answers 410 naming the file, not 500, when an upload's bytes are gone from storage", async () => {
    const token = await tokenFor("engineer@tarnwell.example");
    const res = await callRoute(uploadFirmware, { url: "/api/v1/uploads?name=lost-fw.bin", method: "POST", token, body: new Uint8Array(64).fill(7) });
    expect(res.status).toBe(201);
    const { upload } = (await res.json()) as { upload: { id: string } };
    const [row] = await getDb().select({ storageKey: uploads.storageKey }).from(uploads).where(eq(uploads.id, upload.id));
    // The file vanishes behind the application's back (a volume restored without it).
    fs.rmSync(path.join(storageDir, row!.storageKey));
    const down = await callRoute(downloadUpload, { url: `/api/v1/uploads/${upload.id}`, token, params: { id: upload.id } });
    expect(down.status).toBe(410);
    const text = await down.text();
    const body = JSON.parse(text) as { error: { code: string; message: string } };
    expect(body.error.code).toBe("gone");
    expect(body.error.message).toContain("lost-fw.bin");
    expect(body.error.message).toMatch(/Upload the file again/);
    // Nothing of the server's inside leaks: no file path, no errno, no stack.
    expect(text).not.toMatch(/ENOENT|\/data\/|at [A-Za-z]+ \(/);
    // An id no upload has stays a 404.
    const unknown = "00000000-0000-4000-8000-000000000000";
    expect((await callRoute(downloadUpload, { url: `/api/v1/uploads/${unknown}`, token, params: { id: unknown } })).status).toBe(404);
  });
});
