import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { COMMANDS } from "@/cli/commands";
import { contentHashHex, decodeBank, readIntelHex, type CoolingProfile } from "@/lib/engine";
import { examplePath } from "./fixtures";

const root = path.resolve(__dirname, "../../..");
const bin = path.join(root, "bin/loopkeeper.mjs");
const hw = examplePath("cooler-360.hardware.json");
const quiet = examplePath("quiet.profile.json");
const perf = examplePath("performance.profile.json");

function cli(...args: string[]): { code: number | null; stdout: string; stderr: string } {
  const r = spawnSync(process.execPath, [bin, ...args], { cwd: root, encoding: "utf8", timeout: 30_000 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

const noStack = (text: string): void => {
  expect(text).not.toMatch(/\n\s+at .+:\d+:\d+/);
  expect(text).not.toMatch(/node:internal/);
};

let dir = "";
const tmp = (name: string, content?: string | Uint8Array): string => {
  const f = path.join(dir, name);
  if (content !== undefined) writeFileSync(f, content);
  return f;
};

beforeAll(() => {
  dir = mkdtempSync(path.join(tmpdir(), "loopkeeper-cli-"));
});

describe("cli help and usage", { timeout: 120_000 }, () => {
  it("--help and -h exit 0 for every command, with its options and an example", () => {
    expect(COMMANDS.map((c) => c.name)).toEqual(expect.arrayContaining(["validate", "evaluate", "bank", "inspect", "verify", "vectors", "header", "tach"]));
    for (const command of COMMANDS) {
      const r = cli(command.name, "--help");
      expect(r.code, `${command.name} --help`).toBe(0);
      expect(r.stdout).toContain(`Usage: loopkeeper ${command.name}`);
      expect(r.stdout).toMatch(/Options:\n(\s+--\S+.*\n)+/);
      expect(r.stdout).toMatch(new RegExp(`Examples?:\\n  loopkeeper ${command.name} `));
      expect(r.stderr).toBe("");
    }
    expect(cli("bank", "-h").code).toBe(0);
  });

  it("`npm run -s cli -- <command> --help` exits 0 for every command, as the developer notes write it", { timeout: 600_000 }, () => {
    for (const command of COMMANDS) {
      const r = spawnSync("npm", ["run", "-s", "cli", "--", command.name, "--help"], { cwd: root, encoding: "utf8", timeout: 120_000 });
      expect(r.status, `npm run -s cli -- ${command.name} --help\n${r.stderr}`).toBe(0);
      expect(r.stdout).toContain(`Usage: loopkeeper ${command.name}`);
      expect(r.stderr).toBe("");
    }
  });

  it("--help wins over other mistakes on the same line", () => {
    const r = cli("tach", "--pulses", "2.5", "--bogus", "--help");
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/--host-pulses/);
  });

  it("unknown options name the option and what the command takes (exit 2)", () => {
    const r = cli("validate", quiet, "--bogus");
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/^Unknown option --bogus\. validate takes --hardware, --json, --help/);
    expect(r.stderr).toContain("Usage: loopkeeper validate <profile.json>");
    noStack(r.stderr);
    const j = cli("evaluate", perf, "--hardware", hw, "--speed", "3", "--json");
    expect(j.code).toBe(2);
    expect(JSON.parse(j.stdout)).toMatchObject({ ok: false, exitCode: 2, error: expect.stringMatching(/Unknown option --speed/) });
  });

  it("no command lists the commands (exit 2); help lists them (exit 0)", () => {
    const none = cli();
    expect(none.code).toBe(2);
    const help = cli("--help");
    expect(help.code).toBe(0);
    for (const command of COMMANDS) expect(help.stdout).toContain(`  ${command.name} `);
  });
});

describe("cli validate", { timeout: 60_000 }, () => {
  it("accepts the example profile (exit 0)", () => {
    const r = cli("validate", quiet, "--hardware", hw);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/valid/);
  });

  it("malformed JSON: exit 1 with file:line:column", () => {
    const line3 = '  "criticalTempC": 60,,';
    const f = tmp("broken.json", `{\n  "name": "x",\n${line3}\n}`);
    const r = cli("validate", f);
    expect(r.code).toBe(1);
    // The second comma is where a property name was expected.
    expect(r.stderr).toContain(`${f}:3:${line3.indexOf(",,") + 2}: error json.syntax`);
    noStack(r.stderr);
  });

  it("wrong types: exit 1 naming the JSON pointer, also as --json", () => {
    const doc = JSON.parse(readFileSync(quiet, "utf8"));
    doc.pump.points[1].dutyPct = "fifty";
    const f = tmp("types.json", JSON.stringify(doc, null, 2));
    const r = cli("validate", f);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/schema\.wrong_type \(\/pump\/points\/1\/dutyPct\)/);
    const j = cli("validate", f, "--json");
    expect(j.code).toBe(1);
    const out = JSON.parse(j.stdout);
    expect(out.ok).toBe(false);
    expect(out.issues[0]).toMatchObject({ code: "schema.wrong_type", path: "/pump/points/1/dutyPct" });
    expect(out.issues[0].range.start.line).toBeGreaterThan(1);
  });

  it("usage errors exit 2: no file, unknown option, missing file", () => {
    expect(cli("validate").code).toBe(2);
    expect(cli("validate", quiet, "--bogus").code).toBe(2);
    const missing = cli("validate", tmp("nope.json"));
    expect(missing.code).toBe(2);
    expect(missing.stderr).toMatch(/nope\.json: no such file/);
    expect(cli("frobnicate").code).toBe(2);
    noStack(missing.stderr);
  });
});

describe("cli evaluate", { timeout: 60_000 }, () => {
  it("prints the curve and operating point, --json with numbers", () => {
    const r = cli("evaluate", perf, "--hardware", hw, "--load", "250", "--ambient", "25", "--distance", "2");
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/Operating point at 250 W/);
    // Each thing once: the coolant's name and its property temperature are not two readings.
    expect(r.stdout).toContain("coolant water (properties at 25 °C)");
    expect(r.stdout).toMatch(/noise \d+\.\d dB\(A\) at 1 m, \d+\.\d dB\(A\) at 2 m/);
    const oneMetre = cli("evaluate", perf, "--hardware", hw);
    const noiseLine = oneMetre.stdout.split("\n").find((l) => l.startsWith("  fans "));
    expect(noiseLine).toMatch(/noise \d+\.\d dB\(A\) at 1 m$/);
    expect(r.stdout).toMatch(/lab measurement/);
    const j = JSON.parse(cli("evaluate", perf, "--hardware", hw, "--json").stdout);
    expect(j.curve).toHaveLength(51);
    expect(j.sweep).toHaveLength(31);
    expect(j.operatingPoint.heatLoadW).toBe(200);
  });

  it("a listener distance inside the cooler's near field is refused with the reason and the shortest distance", () => {
    const r = cli("evaluate", perf, "--hardware", hw, "--distance", "0.2");
    expect(r.code).toBe(2);
    expect(r.stderr).toContain("--distance: 0.2 m is inside the cooler's near field (closer than about the radiator's largest dimension, 397 mm), where the estimate does not hold: use at least 0.397 m.");
    noStack(r.stderr);
    expect(cli("evaluate", perf, "--hardware", hw, "--distance", "0.4").code).toBe(0);
  });

  it("a negative ambient is a value, not an option", () => {
    const r = cli("evaluate", perf, "--hardware", hw, "--ambient", "-10");
    expect(r.code).toBe(0);
    expect(r.stdout).toContain("-10 °C ambient air");
  });

  it("bad numbers and a missing --hardware are usage errors; negative load is invalid input", () => {
    expect(cli("evaluate", perf, "--hardware", hw, "--load", "lots").code).toBe(2);
    expect(cli("evaluate", perf).code).toBe(2);
    const neg = cli("evaluate", perf, "--hardware", hw, "--load", "-5");
    expect(neg.code).toBe(1);
    expect(neg.stderr).toMatch(/heatLoadW/);
    noStack(neg.stderr);
  });

  it("an invalid hardware file is listed with its path", () => {
    const f = tmp("hw-bad.json", '{"fanCount": "three"}');
    const r = cli("evaluate", perf, "--hardware", f);
    expect(r.code).toBe(1);
    expect(r.stderr).toContain(`${f}:1:`);
  });
});

describe("cli bank and inspect", { timeout: 60_000 }, () => {
  it("writes .bin and .hex that decode to the same slots", () => {
    const bin2 = tmp("bank.bin");
    const hex = tmp("bank.hex");
    const r = cli("bank", quiet, perf, "--hardware", hw, "--out", bin2, "--hex", hex, "--versions", "1.0.0,2.3.1");
    expect(r.code).toBe(0);
    const bytes = new Uint8Array(readFileSync(bin2));
    const decoded = decodeBank(bytes);
    expect(decoded.ok).toBe(true);
    expect(decoded.slots.map((s) => s.version)).toEqual(["1.0.0", "2.3.1"]);
    const fromHex = readIntelHex(readFileSync(hex, "utf8"));
    expect(fromHex.startAddress).toBe(0x0801f800);
    expect(fromHex.bytes).toEqual(bytes);
    for (const f of [bin2, hex]) {
      const i = cli("inspect", f);
      expect(i.code).toBe(0);
      expect(i.stdout).toMatch(/CRC-32 stored 0x[0-9A-F]{8}, computed 0x[0-9A-F]{8}: match/);
      // Slots are counted from 1 in what people read (the JSON keeps the 0-based position).
      expect(i.stdout).toMatch(/slot 1: v1\.0\.0[\s\S]*slot 2: v2\.3\.1/);
    }
  });

  it("vectors: writes the same bank as `bank` with its stored codes, sweep and traces; refuses a profile that breaks the board's limits", () => {
    const bin2 = tmp("bank-for-vectors.bin");
    const out = tmp("vectors.json");
    expect(cli("bank", quiet, perf, "--hardware", hw, "--out", bin2, "--versions", "1.0.0,2.3.1").code).toBe(0);
    const r = cli("vectors", quiet, perf, "--hardware", hw, "--out", out, "--versions", "1.0.0,2.3.1");
    expect(r.code, r.stderr).toBe(0);
    expect(r.stdout).toMatch(/Wrote .*vectors\.json: 2 slots/);
    const v = JSON.parse(readFileSync(out, "utf8")) as { bank: { hex: string }; slots: { version: string; sweep: { tempCode: number[] }; traces: { name: string; tempDeciC: (number | null)[]; pumpDutyCode: number[] }[] }[] };
    // The vectors describe exactly the image `bank` writes.
    expect(v.bank.hex).toBe(Buffer.from(readFileSync(bin2)).toString("hex"));
    expect(v.slots.map((s) => s.version)).toEqual(["1.0.0", "2.3.1"]);
    for (const s of v.slots) {
      expect(s.sweep.tempCode).toHaveLength(201);
      expect(s.traces.some((t) => t.tempDeciC.includes(null))).toBe(true);
      for (const t of s.traces) expect(t.pumpDutyCode).toHaveLength(t.tempDeciC.length);
    }
    const broken = tmp("broken-sensor-loss.json", readFileSync(quiet, "utf8").replace(/"sensorLossDutyPct":\s*100/, '"sensorLossDutyPct": 0'));
    const bad = cli("vectors", broken, "--hardware", hw, "--out", tmp("never.json"));
    expect(bad.code).toBe(1);
    noStack(bad.stderr);
  });

  it("header: writes the C header and source into the folder; a missing --out is a usage error", () => {
    const out = path.join(dir, "c-ref");
    const r = cli("header", "--out", out);
    expect(r.code, r.stderr).toBe(0);
    expect(readFileSync(path.join(out, "loopkeeper_bank.h"), "utf8")).toMatch(/#define LK_CRC32_CHECK 0xCBF43926u/);
    expect(readFileSync(path.join(out, "loopkeeper_bank.c"), "utf8")).toMatch(/lk_control_tick/);
    expect(cli("header").code).toBe(2);
  });

  it("identifies slots against a known list", () => {
    const b = tmp("bank-known.bin");
    expect(cli("bank", quiet, "--hardware", hw, "--out", b).code).toBe(0);
    const document = JSON.parse(readFileSync(quiet, "utf8")) as CoolingProfile;
    const known = tmp("known.json", JSON.stringify({ profileVersions: [{ profileVersionId: "pv-hush-1", version: "1.0.0", contentHash: contentHashHex(document), document }] }));
    const r = cli("inspect", b, "--known", known, "--json");
    expect(r.code).toBe(0);
    expect(JSON.parse(r.stdout).report.slots[0]).toMatchObject({ match: "exact", profileVersionId: "pv-hush-1" });
    // The old label-only list cannot prove content, so it is refused with the expected shape.
    const labels = tmp("labels.json", JSON.stringify([{ profileVersionId: "pv-hush-1", contentHashPrefix: contentHashHex(document).slice(0, 16), version: "1.0.0" }]));
    const old = cli("inspect", b, "--known", labels);
    expect(old.code).toBe(2);
    expect(old.stderr).toMatch(/needs its stored document/);
  });

  it("refuses a profile that breaks the board's limits, and bad --versions", () => {
    const doc = JSON.parse(readFileSync(quiet, "utf8"));
    doc.pump.points[0].dutyPct = 10;
    const f = tmp("pump-low.json", JSON.stringify(doc, null, 2));
    const r = cli("bank", f, "--hardware", hw, "--out", tmp("x.bin"));
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/pump\.below_min_duty/);
    expect(cli("bank", quiet, "--hardware", hw, "--out", tmp("y.bin"), "--versions", "1.0.0,2.0.0").code).toBe(2);
    const pre = cli("bank", quiet, "--hardware", hw, "--out", tmp("z.bin"), "--versions", "1.0.0-rc.1");
    expect(pre.code).toBe(1);
    expect(pre.stderr).toMatch(/bank\.version_not_encodable/);
  });

  it("truncated and bit-flipped banks: exit 1 naming the offset", () => {
    const b = tmp("good.bin");
    expect(cli("bank", quiet, "--hardware", hw, "--out", b).code).toBe(0);
    const bytes = new Uint8Array(readFileSync(b));
    const cut = cli("inspect", tmp("cut.bin", bytes.subarray(0, 30)));
    expect(cut.code).toBe(1);
    expect(cut.stderr).toMatch(/@ byte 30: error bank\.truncated: The header gives \d+ bytes but only 30 are present/);
    const flipped = bytes.slice();
    flipped[12] = flipped[12]! ^ 0x80;
    const bad = cli("inspect", tmp("flip.bin", flipped));
    expect(bad.code).toBe(1);
    expect(bad.stderr).toMatch(/error bank\.crc_mismatch/);
    const garbage = cli("inspect", tmp("garbage.bin", new Uint8Array([1, 2, 3])));
    expect(garbage.code).toBe(1);
    noStack(garbage.stderr);
  });

  it("HEX with a bad checksum: exit 1 naming the line", () => {
    const h = tmp("good.hex");
    expect(cli("bank", quiet, "--hardware", hw, "--out", tmp("g.bin"), "--hex", h).code).toBe(0);
    const lines = readFileSync(h, "utf8").split("\n");
    lines[2] = `${lines[2]!.slice(0, -2)}${lines[2]!.endsWith("00") ? "01" : "00"}`;
    const r = cli("inspect", tmp("bad.hex", lines.join("\n")));
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/bad\.hex:3: error hex\.bad_checksum/);
    noStack(r.stderr);
  });
});

describe("cli tach", { timeout: 60_000 }, () => {
  it("converts a reading and a frequency", () => {
    // Intel 4-Wire PWM fan spec rev 1.3 §2.1.3: RPM = 60·f/2; 50 Hz → 1,500 RPM.
    expect(JSON.parse(cli("tach", "--hz", "50", "--json").stdout).rpm).toBe(1500);
    // Common practice: a 4-pulse pump read by a 2-pulse host shows twice its speed.
    expect(cli("tach", "--reading", "5600", "--pulses", "4").stdout).toMatch(/2800 RPM real/);
  });

  it("bad input", () => {
    expect(cli("tach", "--reading", "5600").code).toBe(2);
    expect(cli("tach", "--reading", "abc", "--pulses", "4").code).toBe(2);
    // Pulses per revolution are whole numbers 1–8, as tachPulsesPerRev in schemas/hardware-context.schema.json.
    for (const pulses of ["0", "2.5", "9", "-1", "two"]) {
      const bad = cli("tach", "--reading", "5600", "--pulses", pulses);
      expect(bad.code, pulses).toBe(2);
      expect(bad.stderr).toContain(`--pulses is the motor's pulses per revolution: a whole number from 1 to 8, got "${pulses}"`);
    }
    expect(cli("tach", "--hz", "50", "--host-pulses", "1.5").code).toBe(2);
    expect(cli("tach", "--reading", "5600", "--pulses", "8").code).toBe(0);
    expect(cli("tach", "--reading", "5600", "--pulses", "1").code).toBe(0);
    const j = cli("tach", "--json");
    expect(j.code).toBe(2);
    expect(JSON.parse(j.stdout)).toMatchObject({ ok: false, exitCode: 2 });
  });
});
