import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, demoActor, getDb } from "./support/db";
import { freshDraftBuild } from "./support/builds";
import { transitionBuild } from "@/db/build-stages";
import { listBankSigningKeys } from "@/db/bank-signatures";
import { builds } from "@/db/schema";
import { writeIntelHex } from "@/lib/engine";
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
    await transitionBuild(db, actor, { id: build.id, from: "validation", to: "pilot", gate: async () => [], mails: async () => [] });
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
});
