import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, demoActor, getDb } from "./support/db";
import { freshDraftBuild } from "./support/builds";
import { lockBuild } from "@/db/build-stages";
import { enterStage } from "@/lib/use-cases/builds/stages";
import { listBankSigningKeys } from "@/db/bank-signatures";
import { builds } from "@/db/schema";
import { writeIntelHex, type DumpReport } from "@/lib/engine";
import { callRoute, tokenFor } from "./support/http";
import { POST as identifyRoute } from "@/app/api/v1/dumps/identify/route";
import { formatSignatureBlock } from "@/lib/signing/signature-block";

afterAll(closeDb);

const root = path.resolve(__dirname, "../..");
const cli = (...args: string[]) => spawnSync(process.execPath, [path.join(root, "bin/loopkeeper.mjs"), ...args], { cwd: root, encoding: "utf8", timeout: 60_000 });

describe("bank signatures", () => {
  it("a build entering pilot is signed in the same move; verify accepts it with the board's key, and one changed byte fails", async () => {
    const db = getDb();
    const build = await freshDraftBuild();
    const actor = await demoActor("release@tarnwell.example");
    // Straight to the pilot move: the stage gates are judged elsewhere; here only the signing hook is under test.
    await db.update(builds).set({ stage: "validation" }).where(eq(builds.id, build.id));
    await db.transaction(async (tx) => enterStage(tx, actor, (await lockBuild(tx, { id: build.id }))!, { to: "pilot" }));
    const [row] = await db.select().from(builds).where(eq(builds.id, build.id));
    expect(row!.stage).toBe("pilot");
    expect(row!.bankSignature?.length).toBe(64);
    const keys = await listBankSigningKeys(db, { boardModelId: row!.boardModelId });
    const key = keys.find((k) => k.keyId === row!.bankSignatureKeyId);
    expect(key).toBeDefined();
    expect(key!.validUntil).toBeNull();
    // The private key never reaches the database.
    expect(JSON.stringify(keys)).not.toMatch(/PRIVATE KEY/);

    const dir = mkdtempSync(path.join(tmpdir(), "loopkeeper-sign-"));
    const image = new Uint8Array(row!.bankImage!);
    const files = { bin: path.join(dir, "bank.bin"), hex: path.join(dir, "bank.hex"), sig: path.join(dir, "bank.sig"), pem: path.join(dir, "key.pem"), bad: path.join(dir, "bad.bin") };
    writeFileSync(files.bin, image);
    writeFileSync(files.hex, writeIntelHex(image, 0x0801f800));
    writeFileSync(files.sig, formatSignatureBlock({ keyId: row!.bankSignatureKeyId!, signature: new Uint8Array(row!.bankSignature!) }));
    writeFileSync(files.pem, key!.publicKeyPem);
    for (const f of [files.bin, files.hex]) {
      const ok = cli("verify", f, "--signature", files.sig, "--public-key", files.pem);
      expect(ok.status, ok.stderr).toBe(0);
      expect(ok.stdout).toContain(`signed by key ${row!.bankSignatureKeyId}: valid`);
    }
    // One byte changed, CRC-32 written again so only the signature can object.
    const changed = image.slice();
    changed[30] = changed[30]! ^ 0x01;
    const zlib = await import("node:zlib");
    new DataView(changed.buffer).setUint32(changed.length - 4, zlib.crc32(changed.subarray(0, changed.length - 4)), true);
    writeFileSync(files.bad, changed);
    const bad = cli("verify", files.bad, "--signature", files.sig, "--public-key", files.pem);
    expect(bad.status).toBe(1);
    expect(bad.stderr).toMatch(/does not match this image/);
  });

  it("identification says whose signature a dump carries: valid for a pilot build's bank, invalid after a changed byte, unsigned for a draft", async () => {
    const db = getDb();
    const build = await freshDraftBuild();
    const draft = await freshDraftBuild();
    const actor = await demoActor("release@tarnwell.example");
    await db.update(builds).set({ stage: "validation" }).where(eq(builds.id, build.id));
    await db.transaction(async (tx) => enterStage(tx, actor, (await lockBuild(tx, { id: build.id }))!, { to: "pilot" }));
    const [row] = await db.select().from(builds).where(eq(builds.id, build.id));
    const [draftRow] = await db.select().from(builds).where(eq(builds.id, draft.id));
    const keyId = row!.bankSignatureKeyId!;
    const image = new Uint8Array(row!.bankImage!);
    const sig = formatSignatureBlock({ keyId, signature: new Uint8Array(row!.bankSignature!) });
    const token = await tokenFor("support@tarnwell.example");
    const identify = async (bytes: Uint8Array, sidecar?: Uint8Array): Promise<DumpReport> => {
      const form = new FormData();
      form.set("file", new Blob([Buffer.from(bytes)]), "dump.bin");
      if (sidecar) form.set("signature", new Blob([Buffer.from(sidecar)]), "dump.sig");
      const res = await callRoute(identifyRoute, { url: "/api/v1/dumps/identify", method: "POST", token, body: form });
      expect(res.status).toBe(200);
      return (await res.json()) as DumpReport;
    };

    // The image of a signed build: its kept signature is checked against the registry's key.
    const fromBuild = await identify(image);
    expect(fromBuild.signature).toMatchObject({ status: "valid", keyId, source: "build", summary: `signed by key ${keyId}: valid` });
    // The same with the .sig given, and with the block stored after the CRC on a board with room.
    expect((await identify(image, sig)).signature).toMatchObject({ status: "valid", source: "sidecar" });
    const withBlock = new Uint8Array(image.length + sig.length + 32).fill(0xff);
    withBlock.set(image);
    withBlock.set(sig, image.length);
    const stored = await identify(withBlock);
    expect(stored.status).toBe("ok");
    expect(stored.signature).toMatchObject({ status: "valid", source: "stored" });

    // One byte changed and the CRC-32 written again: no build matches, the .sig no longer fits.
    const changed = image.slice();
    changed[30] = changed[30]! ^ 0x01;
    const zlib = await import("node:zlib");
    new DataView(changed.buffer).setUint32(changed.length - 4, zlib.crc32(changed.subarray(0, changed.length - 4)), true);
    const altered = await identify(changed, sig);
    expect(altered.signature).toMatchObject({ status: "invalid", keyId, summary: `signed by key ${keyId}: invalid` });
    expect(altered.faults.join("\n")).toMatch(/does not match this image/);

    // A draft's bank is not signed.
    const unsigned = await identify(new Uint8Array(draftRow!.bankImage!));
    expect(unsigned.signature).toMatchObject({ status: "unsigned", summary: "unsigned" });
  });
});
