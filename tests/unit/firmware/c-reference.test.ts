import { spawnSync } from "node:child_process";
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import fc from "fast-check";
import { beforeAll, describe, expect, it } from "vitest";
import { decodeBank, encodeBank, type CoolingProfile } from "@/lib/engine";
import { bankVectors, C_HEADER_FILE, C_SOURCE_FILE, type FirmwareVectors } from "@/lib/firmware";
import { formatSignatureBlock } from "@/lib/signing/signature-block";
import { demoBankImages } from "../engine/demo-images";
import { validProfileArb } from "../engine/fixtures";

/*
 * The generated C reference (loopkeeper header) compiled with Debian's gcc and run over
 * the vectors (lib/firmware) of the demo banks and of at least 200 random valid profiles:
 * every decoded field, every CRC, every steady duty code and every duty code per tick
 * must agree with the TypeScript engine. `node scripts/test.mjs` installs gcc when missing.
 */

const root = path.resolve(__dirname, "../../..");
const GCC = "gcc";
const STRICT = ["-Wall", "-Wextra", "-Werror", "-pedantic"];
let dir = "";

function gcc(args: string[]): { code: number | null; stderr: string } {
  const r = spawnSync(GCC, args, { cwd: dir, encoding: "utf8", timeout: 120_000 });
  if (r.error) throw new Error(`gcc could not be run (${r.error.message}); install it with apt-get install gcc, or run node scripts/test.mjs, which installs it.`);
  return { code: r.status, stderr: r.stderr };
}

function runner(binary: string, input: string): string[] {
  const r = spawnSync(path.join(dir, binary), [], { input, encoding: "utf8", maxBuffer: 256 * 1024 * 1024, timeout: 120_000 });
  expect(r.status, r.stderr).toBe(0);
  return r.stdout.trimEnd().split("\n");
}

/** The runner's commands for one bank image and its traces. */
function commandsFor(hexImage: string, v: FirmwareVectors | null): string[] {
  const lines = [`B ${hexImage}`];
  for (const slot of v?.slots ?? []) {
    for (const t of slot.traces) lines.push(`T ${slot.index} ${t.tempDeciC.length} ${t.tempDeciC.map((x) => (x === null ? "N" : String(x))).join(" ")}`);
  }
  return lines;
}

const curveLine = (name: string, c: FirmwareVectors["slots"][number]["codes"]["pump"]): string =>
  [name, c.points.length, c.hysteresisCode, c.rampUpCode, c.rampDownCode, ...c.points.flatMap((p) => [p.tempCode, p.dutyCode])].join(" ");

/** What the runner must print for a bank whose vectors the engine computed. */
function expectedFor(v: FirmwareVectors, signatureBlock: 0 | 1): string[] {
  const crc = v.bank.crc32.toString(16).padStart(8, "0");
  const lines = [`H 0 ${v.bank.byteLength} ${v.slots.length} ${crc} ${crc} ${signatureBlock}`];
  for (const s of v.slots) {
    const c = s.codes;
    lines.push(`S ${s.index} ${s.offset} ${s.contentHashPrefix} ${s.version} ${c.criticalTempCode} ${c.sensorLossDutyCode} ${c.fanStopTempCode ?? 255} ${curveLine("P", c.pump)} ${curveLine("F", c.fans)}`);
    lines.push(`W ${s.index} ${s.sweep.pumpDutyCode.flatMap((p, i) => [p, s.sweep.fanDutyCode[i]]).join(" ")}`);
  }
  for (const s of v.slots) for (const t of s.traces) lines.push(`R ${t.pumpDutyCode.flatMap((p, i) => [p, t.fanDutyCode[i]]).join(" ")}`);
  return lines;
}

const hexOf = (bytes: Uint8Array): string => Buffer.from(bytes).toString("hex");

function vectorsOf(bytes: Uint8Array): FirmwareVectors {
  const r = bankVectors(bytes);
  if (!r.ok) throw new Error(r.errors.map((e) => e.message).join("; "));
  return r.vectors;
}

/** Lines that differ, with their index, so a failure shows where C and TypeScript part. */
function differences(actual: string[], expected: string[]): string[] {
  const out: string[] = [];
  for (let i = 0; i < Math.max(actual.length, expected.length) && out.length < 5; i++) {
    if (actual[i] !== expected[i]) out.push(`line ${i}:\n  C:  ${actual[i]?.slice(0, 400)}\n  TS: ${expected[i]?.slice(0, 400)}`);
  }
  return out;
}

beforeAll(() => {
  dir = mkdtempSync(path.join(tmpdir(), "loopkeeper-c-"));
  const r = spawnSync(process.execPath, [path.join(root, "bin/loopkeeper.mjs"), "header", "--out", dir], { cwd: root, encoding: "utf8", timeout: 60_000 });
  expect(r.status, r.stderr).toBe(0);
  writeFileSync(path.join(dir, "vector-runner.c"), readFileSync(path.join(__dirname, "vector-runner.c")));
}, 120_000);

describe("C reference (loopkeeper header) against the engine", { timeout: 300_000 }, () => {
  it("writes the header and source, and gcc compiles them with -std=c99 -Wall -Wextra -Werror -pedantic (and as C11)", () => {
    expect(existsSync(path.join(dir, C_HEADER_FILE)) && existsSync(path.join(dir, C_SOURCE_FILE))).toBe(true);
    const header = readFileSync(path.join(dir, C_HEADER_FILE), "utf8");
    expect(header).toMatch(/#define LK_BANK_MAGIC "LKPB"/);
    expect(header).toMatch(/LK_STATIC_ASSERT\(sizeof\(lk_slot_fixed_raw_t\) == LK_SLOT_FIXED_BYTES/);
    for (const std of ["c99", "c11"]) {
      const r = gcc([`-std=${std}`, ...STRICT, "-I.", "-o", `runner-${std}`, "vector-runner.c", C_SOURCE_FILE]);
      expect(r.code, r.stderr).toBe(0);
    }
  });

  it("the size and offset asserts stop the build when the layout disagrees", () => {
    writeFileSync(path.join(dir, "wrong-size.c"), `#include "${C_HEADER_FILE}"\nLK_STATIC_ASSERT(sizeof(lk_header_raw_t) == LK_HEADER_BYTES + 1u, wrong_header_size);\n`);
    for (const std of ["c99", "c11"]) expect(gcc([`-std=${std}`, ...STRICT, "-I.", "-c", "-o", "wrong-size.o", "wrong-size.c"]).code).not.toBe(0);
  });

  it("CRC-32 of \"123456789\" is 0xCBF43926, the check value of CRC-32/ISO-HDLC (Greg Cook, Catalogue of parametrised CRC algorithms)", () => {
    expect(runner("runner-c99", "K 123456789\n")).toEqual(["K cbf43926"]);
  });

  it("agrees on every field, CRC, sweep and tick of the demo banks, also with a stored signature block after the CRC", () => {
    const images = demoBankImages();
    expect(images.length).toBeGreaterThanOrEqual(3);
    const input: string[] = [];
    const expected: string[] = [];
    for (const { bytes } of images) {
      const v = vectorsOf(bytes);
      input.push(...commandsFor(hexOf(bytes), v));
      expected.push(...expectedFor(v, 0));
      // A board with room keeps the 77-byte signature block after the CRC, then erased memory.
      const withBlock = new Uint8Array(bytes.length + 77 + 16).fill(0xff);
      withBlock.set(bytes, 0);
      withBlock.set(formatSignatureBlock({ keyId: "0123456789abcdef", signature: new Uint8Array(64).fill(7) }), bytes.length);
      expect(decodeBank(withBlock).ok).toBe(true);
      input.push(...commandsFor(hexOf(withBlock), v));
      expected.push(...expectedFor(v, 1));
    }
    const actual = runner("runner-c99", `${input.join("\n")}\n`);
    expect(differences(actual, expected)).toEqual([]);
    expect(actual.length).toBe(expected.length);
  });

  it("refuses what the engine refuses: a changed CRC, bytes after the image, 0 slots", () => {
    const bytes = demoBankImages()[0]!.bytes;
    const badCrc = bytes.slice();
    badCrc[badCrc.length - 1]! ^= 0x01;
    const trailing = new Uint8Array(bytes.length + 4).fill(0xff);
    trailing.set(bytes, 0);
    trailing[bytes.length + 2] = 0x00;
    const noSlots = bytes.slice();
    noSlots[5] = 0;
    const cases = [
      { image: badCrc, status: 5, code: "bank.crc_mismatch" },
      { image: trailing, status: 8, code: "bank.trailing_data" },
    ];
    const out = runner("runner-c99", `${[...cases.map((c) => c.image), noSlots].map((b) => `B ${hexOf(b)}`).join("\n")}\n`);
    cases.forEach((c, i) => {
      expect(out[i]?.split(" ")[1]).toBe(String(c.status));
      expect(decodeBank(c.image).errors.map((e) => e.code)).toContain(c.code);
    });
    // 0 slots with an unchanged CRC: the C reference stops at the CRC (5), the engine reports both.
    expect(out[2]?.split(" ")[1]).toBe("5");
    expect(decodeBank(noSlots).errors.map((e) => e.code)).toEqual(expect.arrayContaining(["bank.crc_mismatch", "bank.no_slots"]));
  });

  it("agrees on every field, CRC, sweep and tick for at least 200 random valid profiles", () => {
    // size "max": banks of 1–4 slots and curves of up to 8 points, not fast-check's small default.
    const banks = fc.sample(fc.array(validProfileArb, { minLength: 1, maxLength: 4, size: "max" }), { numRuns: 110, seed: 20261202 });
    const profiles: CoolingProfile[] = banks.flat();
    expect(profiles.length).toBeGreaterThanOrEqual(200);
    expect(Math.max(...banks.map((b) => b.length))).toBe(4);
    expect(Math.max(...profiles.map((p) => Math.max(p.pump.points.length, p.fans.points.length)))).toBeGreaterThanOrEqual(7);
    expect(profiles.some((p) => p.fans.stopBelowTempC !== undefined) && profiles.some((p) => p.fans.stopBelowTempC === undefined)).toBe(true);

    const input: string[] = [];
    const expected: string[] = [];
    let ticks = 0;
    for (const docs of banks) {
      const encoded = encodeBank(docs.map((profile, i) => ({ profile, version: `2.${i}.${docs.length}` })));
      if (!encoded.ok) throw new Error(encoded.errors.map((e) => e.message).join("; "));
      const v = vectorsOf(encoded.bytes);
      ticks += v.slots.reduce((n, s) => n + s.traces.reduce((m, t) => m + t.tempDeciC.length, 0), 0);
      input.push(...commandsFor(hexOf(encoded.bytes), v));
      expected.push(...expectedFor(v, 0));
    }
    // Every slot's traces include missing readings, the critical temperature and a dither.
    expect(ticks).toBeGreaterThan(200 * 400);
    const actual = runner("runner-c99", `${input.join("\n")}\n`);
    expect(differences(actual, expected)).toEqual([]);
    expect(actual.length).toBe(expected.length);
  });
});
