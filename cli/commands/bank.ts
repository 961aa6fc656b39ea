import { writeFileSync } from "node:fs";
import { contentHashHex, encodeBank, writeIntelHex, type BankSlotInput } from "../../lib/engine";
import { parseArgs, UsageError } from "../args";
import { formatIssues, readText, type CommandResult } from "../io";
import { loadHardware, loadProfile } from "./load";

export const BANK_USAGE = "bank <profile.json>... --hardware hw.json --out bank.bin [--hex bank.hex] [--versions 1.0.0,1.1.0] [--json]";

function write(file: string, data: Uint8Array | string): void {
  try {
    writeFileSync(file, data);
  } catch (e) {
    throw new UsageError(`${file}: cannot be written (${(e as NodeJS.ErrnoException).code ?? "error"}).`);
  }
}

/** `bank`: encode profiles into a bank image for the board revision, optionally as Intel HEX too. */
export function bankCommand(argv: readonly string[]): CommandResult {
  const args = parseArgs(argv, ["hardware", "out", "hex", "versions"], ["json"]);
  const files = args.positionals;
  if (files.length === 0) throw new UsageError(`Give at least one profile file: ${BANK_USAGE}`);
  const hwFile = args.options.get("hardware");
  const out = args.options.get("out");
  if (!hwFile || !out) throw new UsageError(`--hardware and --out are required: ${BANK_USAGE}`);
  const versions = args.options.get("versions")?.split(",") ?? files.map(() => "1.0.0");
  if (versions.length !== files.length) throw new UsageError(`--versions lists ${versions.length} versions for ${files.length} profiles; give one per profile, in order.`);

  const hw = loadHardware(hwFile);
  if (!hw.ok || !hw.value) return { exitCode: 1, human: formatIssues(hw.file, hw.issues), json: { ok: false, hardware: { file: hw.file, issues: hw.issues } } };
  const loaded = files.map((f) => loadProfile(f, hw.value));
  const bad = loaded.filter((l) => !l.ok);
  if (bad.length > 0) {
    return {
      exitCode: 1,
      human: bad.map((l) => formatIssues(l.file, l.issues.filter((i) => i.severity === "error"))).join("\n"),
      json: { ok: false, profiles: bad.map((l) => ({ file: l.file, issues: l.issues })) },
    };
  }
  const slots: BankSlotInput[] = loaded.map((l, i) => ({ profile: l.value!, version: versions[i]!.trim(), contentHashHex: contentHashHex(JSON.parse(readText(l.file))) }));
  const board = hw.value.boardRevision;
  const encoded = encodeBank(slots, { memoryBytes: board.memoryBytes, slotCount: board.slotCount });
  if (!encoded.ok) {
    return { exitCode: 1, human: encoded.errors.map((e) => `error ${e.code}: ${e.message}`).join("\n"), json: { ok: false, errors: encoded.errors } };
  }
  write(out, encoded.bytes);
  const hexFile = args.options.get("hex");
  if (hexFile) write(hexFile, writeIntelHex(encoded.bytes, board.baseAddress));
  const bytes = encoded.bytes;
  const crc = new DataView(bytes.buffer, bytes.byteOffset).getUint32(bytes.length - 4, true);
  const crcHex = `0x${crc.toString(16).toUpperCase().padStart(8, "0")}`;
  const slotInfo = slots.map((s, i) => ({ slot: i, file: files[i], version: s.version, contentHashPrefix: s.contentHashHex!.slice(0, 16) }));
  const human = [
    `Wrote ${out}: ${bytes.length} of ${board.memoryBytes} bytes (${((100 * bytes.length) / board.memoryBytes).toFixed(0)} %), ${slots.length} of ${board.slotCount} slots, CRC-32 ${crcHex}.`,
    ...(hexFile ? [`Wrote ${hexFile}: Intel HEX at base address 0x${board.baseAddress.toString(16).toUpperCase().padStart(8, "0")}.`] : []),
    ...slotInfo.map((s) => `  slot ${s.slot}: ${s.file} v${s.version} hash ${s.contentHashPrefix}`),
  ].join("\n");
  return { exitCode: 0, human, json: { ok: true, out, hex: hexFile ?? null, byteLength: bytes.length, memoryBytes: board.memoryBytes, crc32: crcHex, slots: slotInfo } };
}
