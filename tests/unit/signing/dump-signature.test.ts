import { createHash } from "node:crypto";
import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { encodeBank, reportDump, type DumpReport } from "@/lib/engine";
import { keyIdOf, privateKeyFromSeed, publicKeyPem, signEd25519, verifyWithPem } from "@/lib/signing/ed25519";
import { formatSignatureBlock } from "@/lib/signing/signature-block";
import { quietProfile } from "../engine/fixtures";

// Keys from RFC 8032 §7.1 TEST 1 and TEST 2 (secret keys as 32-byte seeds), so the key ids are fixed.
const keyA = privateKeyFromSeed(new Uint8Array(Buffer.from("9d61b19deffd5a60ba844af492ec2cc44449c5697b326919703bac031cae7f60", "hex")));
const keyB = privateKeyFromSeed(new Uint8Array(Buffer.from("4ccd089b28ff96da9db6c346ec114e0f5b8a319f35aba624da8cf6ed4fb8a6fb", "hex")));
const refA = { keyId: keyIdOf(keyA), publicKeyPem: publicKeyPem(keyA), boardModelName: "TC-1" };
const refB = { keyId: keyIdOf(keyB), publicKeyPem: publicKeyPem(keyB) };

const encoded = encodeBank([{ profile: quietProfile(), version: "1.0.0" }]);
if (!encoded.ok) throw new Error("example profile does not encode");
const image = encoded.bytes;
const sigA = formatSignatureBlock({ keyId: refA.keyId, signature: signEd25519(keyA, image) });

const report = (bytes: Uint8Array, opts: { sidecar?: Uint8Array; keys?: (typeof refA | typeof refB)[]; build?: boolean } = {}): DumpReport =>
  reportDump({
    bytes,
    fileName: null,
    known: [],
    builds: opts.build ? [{ buildId: "b1", version: "3.1.0", stage: "pilot", bankSha256: createHash("sha256").update(image).digest("hex"), bankSignature: { keyId: refA.keyId, signature: signEd25519(keyA, image) } }] : [],
    signature: { sidecar: opts.sidecar, keys: opts.keys ?? [refA, refB], verify: verifyWithPem },
  });

describe("dump signature: signed by key K: valid / invalid / unsigned", () => {
  it("a .sig of this image by a listed key is valid; by an unlisted key or for other bytes, invalid and a fault", () => {
    expect(report(image, { sidecar: sigA }).signature).toMatchObject({ status: "valid", keyId: refA.keyId, source: "sidecar", summary: `signed by key ${refA.keyId}: valid` });
    const onlyB = report(image, { sidecar: sigA, keys: [refB] });
    expect(onlyB.signature?.status).toBe("invalid");
    expect(onlyB.faults.some((f) => f.includes(`signed by key ${refA.keyId}: invalid`))).toBe(true);
    const forged = formatSignatureBlock({ keyId: refA.keyId, signature: signEd25519(keyB, image) });
    expect(report(image, { sidecar: forged }).signature?.status).toBe("invalid");
    expect(report(image, { sidecar: new Uint8Array(10) }).signature?.status).toBe("invalid");
  });

  it("reads the block a board with room stores after the CRC, and the matching build's signature", () => {
    const withBlock = new Uint8Array(image.length + sigA.length + 8).fill(0xff);
    withBlock.set(image);
    withBlock.set(sigA, image.length);
    const stored = report(withBlock);
    expect(stored.status).toBe("ok");
    expect(stored.signature).toMatchObject({ status: "valid", source: "stored" });
    expect(report(image, { build: true }).signature).toMatchObject({ status: "valid", source: "build" });
  });

  it("says unsigned when there is no signature anywhere, and not checked when no key is given", () => {
    expect(report(image).signature).toMatchObject({ status: "unsigned", summary: "unsigned" });
    expect(report(image, { sidecar: sigA, keys: [] }).signature).toMatchObject({ status: "unverified", summary: `signed by key ${refA.keyId}: not checked` });
  });

  it("loopkeeper inspect prints the same line and exits 1 on an invalid signature", () => {
    const dir = mkdtempSync(path.join(tmpdir(), "loopkeeper-inspect-sig-"));
    const files = { bin: path.join(dir, "bank.bin"), sig: path.join(dir, "bank.sig"), a: path.join(dir, "a.pem"), b: path.join(dir, "b.pem") };
    writeFileSync(files.bin, image);
    writeFileSync(files.sig, sigA);
    writeFileSync(files.a, refA.publicKeyPem);
    writeFileSync(files.b, refB.publicKeyPem);
    const cli = (...args: string[]) => spawnSync(process.execPath, [path.resolve(__dirname, "../../../bin/loopkeeper.mjs"), "inspect", ...args], { encoding: "utf8", timeout: 60_000 });
    const ok = cli(files.bin, "--signature", files.sig, "--public-key", files.a);
    expect(ok.status, ok.stderr).toBe(0);
    expect(ok.stdout).toContain(`Signature: signed by key ${refA.keyId}: valid.`);
    const bad = cli(files.bin, "--signature", files.sig, "--public-key", files.b);
    expect(bad.status).toBe(1);
    expect(bad.stderr).toContain(`Signature: signed by key ${refA.keyId}: invalid.`);
    expect(cli(files.bin).stdout).toContain("Signature: unsigned.");
  }, 120_000);
});
