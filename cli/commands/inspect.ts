import { decodeBank, identifySlots, readIntelHex, type HexStartRecord, type KnownProfileVersion, type SlotIdentity } from "../../lib/engine";
import { parseArgs, UsageError } from "../args";
import { readBytes, readText, type CommandResult } from "../io";

export const INSPECT_USAGE = "inspect <dump.bin|dump.hex> [--known known.json] [--json]";

function loadKnown(file: string): KnownProfileVersion[] {
  let parsed: unknown;
  try {
    parsed = JSON.parse(readText(file));
  } catch {
    throw new UsageError(`${file}: not JSON; expected [{ "profileVersionId", "contentHashPrefix", "version" }, …].`);
  }
  const ok = Array.isArray(parsed) && parsed.every((k) => typeof k === "object" && k !== null && ["profileVersionId", "contentHashPrefix", "version"].every((f) => typeof (k as Record<string, unknown>)[f] === "string"));
  if (!ok) throw new UsageError(`${file}: expected [{ "profileVersionId", "contentHashPrefix", "version" }, …] with string values.`);
  return parsed as KnownProfileVersion[];
}

const hex4 = (n: number): string => n.toString(16).toUpperCase().padStart(4, "0");
const describeStartRecord = (r: HexStartRecord): string =>
  r.type === 3 ? `execution starts at CS:IP ${hex4(r.segment ?? 0)}:${hex4(r.offset ?? 0)}` : `execution starts at 0x${(r.linearAddress ?? 0).toString(16).toUpperCase().padStart(8, "0")}`;

const looksLikeHex = (file: string, bytes: Uint8Array): boolean => /\.(hex|ihx)$/i.test(file) || bytes[0] === 0x3a;

/** `inspect`: decode a bank image or memory dump (.bin or Intel HEX), check its CRC, list and identify slots. */
export function inspectCommand(argv: readonly string[]): CommandResult {
  const args = parseArgs(argv, ["known"], ["json"]);
  if (args.positionals.length !== 1) throw new UsageError(`Give one dump file: ${INSPECT_USAGE}`);
  const file = args.positionals[0]!;
  const known = args.options.get("known");
  const knownList = known ? loadKnown(known) : undefined;
  let bytes = readBytes(file);
  let startAddress: number | undefined;
  let startRecords: HexStartRecord[] = [];
  if (looksLikeHex(file, bytes)) {
    const hex = readIntelHex(new TextDecoder().decode(bytes));
    if (!hex.ok) {
      return { exitCode: 1, human: hex.errors.map((e) => `${file}:${e.line}: error ${e.code}: ${e.message}`).join("\n"), json: { ok: false, file, hexErrors: hex.errors } };
    }
    bytes = hex.bytes;
    startAddress = hex.startAddress;
    startRecords = hex.startRecords;
  }
  const d = decodeBank(bytes);
  const ids: SlotIdentity[] | undefined = knownList ? identifySlots(d.slots, knownList) : undefined;
  const lines: string[] = [];
  if (startAddress !== undefined) lines.push(`${file}: Intel HEX, data from 0x${startAddress.toString(16).toUpperCase().padStart(8, "0")}, ${bytes.length} bytes.`);
  for (const r of startRecords) lines.push(`${file}:${r.line}: start-address record (type 0${r.type}): ${describeStartRecord(r)}; it places no data.`);
  if (d.byteLength !== undefined) lines.push(`Bank format ${d.formatVersion}, ${d.slotCount} slots, ${d.byteLength} bytes.`);
  if (d.crc) lines.push(`CRC-32 stored 0x${d.crc.stored.toString(16).toUpperCase().padStart(8, "0")}, computed 0x${d.crc.computed.toString(16).toUpperCase().padStart(8, "0")}: ${d.crc.stored === d.crc.computed ? "match" : "MISMATCH"}.`);
  for (const s of d.slots) {
    const id = ids?.find((i) => i.slotIndex === s.index);
    const who = id ? (id.match === "exact" ? ` = ${id.profileVersionId}` : id.match === "hash_only" ? ` content of ${id.profileVersionId} (registry has v${id.knownVersion})` : " unknown profile version") : "";
    const st = s.settings;
    lines.push(`  slot ${s.index}: v${s.version} hash ${s.contentHashPrefix}${who}; critical ${st.criticalTempC} °C, sensor loss ${st.sensorLossDutyPct} %, pump ${st.pump.points.length} points, fans ${st.fans.points.length} points${st.fans.stopBelowTempC !== undefined ? `, fans stop below ${st.fans.stopBelowTempC} °C` : ""}`);
  }
  for (const e of d.errors) lines.push(`${file}${e.offset !== undefined ? ` @ byte ${e.offset}` : ""}: error ${e.code}: ${e.message}`);
  return { exitCode: d.ok ? 0 : 1, human: lines.join("\n"), json: { ...d, file, startAddress: startAddress ?? null, startRecords, identities: ids ?? null } };
}
