import { readIntelHex } from "../hex/read";
import { hex32 } from "../hex/address";
import { decodeBank } from "./decode";
import { judgeSignature, type DumpSignature, type SigningKeyRef, type VerifySignature } from "./dump-signature";
import { identifySlots, imageBytes, imageSha256, matchBuild, type RegistryBuild, type RegistryVersion, type SlotReport } from "./identify";


/** Intel HEX when the text starts with a record mark (after blanks or a UTF-8 byte-order mark); anything else is a raw binary image. */
export function looksLikeIntelHex(bytes: Uint8Array): boolean {
  let i = 0;
  while (i < bytes.length && (bytes[i] === 0x20 || bytes[i] === 0x0a || bytes[i] === 0x0d || bytes[i] === 0x09 || bytes[i] === 0xef || bytes[i] === 0xbb || bytes[i] === 0xbf)) i++;
  return bytes[i] === 0x3a; // ':'
}

/** What a memory dump holds, as support, the API and the command line show it. */
export interface DumpReport {
  fileName: string | null;
  format: "bin" | "hex";
  sizeBytes: number;
  hex?: { ok: boolean; startAddress?: number; recordCount: number; errors: { line: number; message: string }[]; startRecords: { line: number; type: number; address: string }[] };
  /** ok: header, CRC and every record and slot are sound; corrupt: damaged; unreadable: no bank found. */
  status: "ok" | "corrupt" | "unreadable";
  crc?: { stored: string; computed: string; ok: boolean };
  slotCount?: number;
  /** SHA-256 of the image, header to CRC. */
  imageSha256?: string;
  /** The build whose bank this image is, byte for byte (by SHA-256). */
  build?: { buildId: string; version: string; stage: string; boardModelName?: string };
  slots: SlotReport[];
  /** The Ed25519 signature check, when keys or a signature were given to check with. */
  signature?: DumpSignature;
  /** Slots that are not exact, or whose contents break the authoring rules: what support must act on. */
  faults: string[];
  errors: { code: string; message: string }[];
}

/**
 * Reads a dump (Intel HEX or binary), checks the bank header and CRC-32,
 * identifies every slot by content against the registry's versions, runs
 * the authoring rules on each decoded slot, and names the build whose bank
 * the image is when its SHA-256 equals one the registry keeps. The command
 * line and the server call this one function, so they give the same answer.
 */
export function reportDump(input: DumpInput): DumpReport {
  const { report, image, decoded } = readDump(input);
  if (input.signature) {
    const build = report.build ? input.builds.find((b) => b.buildId === report.build?.buildId) : undefined;
    report.signature = judgeSignature({
      image,
      sidecar: input.signature.sidecar,
      stored: decoded?.signatureBlock,
      build: build?.bankSignature ? { ...build.bankSignature, version: build.version } : undefined,
      keys: input.signature.keys,
      verify: input.signature.verify,
    });
    if (report.signature.status === "invalid") report.faults.push(`Signature ${report.signature.summary}: ${report.signature.message}`);
  }
  return report;
}

/** A dump and what to identify it by. */
export interface DumpInput {
  bytes: Uint8Array;
  fileName: string | null;
  known: readonly RegistryVersion[];
  builds: readonly RegistryBuild[];
  /** Check the image's Ed25519 signature: a supplied .sig, else one stored after the CRC, else the matching build's. */
  signature?: { sidecar?: Uint8Array; keys: readonly SigningKeyRef[]; verify: VerifySignature };
}

function readDump(input: DumpInput): { report: DumpReport; image?: Uint8Array; decoded?: ReturnType<typeof decodeBank> } {
  const isHex = looksLikeIntelHex(input.bytes);
  let bytes = input.bytes;
  const result: DumpReport = { fileName: input.fileName, format: isHex ? "hex" : "bin", sizeBytes: input.bytes.length, status: "unreadable", slots: [], faults: [], errors: [] };
  if (isHex) {
    const hex = readIntelHex(new TextDecoder().decode(input.bytes));
    result.hex = {
      ok: hex.ok,
      startAddress: hex.startAddress,
      recordCount: hex.recordCount,
      errors: hex.errors.map((e) => ({ line: e.line, message: e.message })),
      startRecords: hex.startRecords.map((r) => ({ line: r.line, type: r.type, address: r.type === 3 ? `${(r.segment ?? 0).toString(16).toUpperCase().padStart(4, "0")}:${(r.offset ?? 0).toString(16).toUpperCase().padStart(4, "0")}` : hex32(r.linearAddress ?? 0) })),
    };
    result.errors.push(...hex.errors.map((e) => ({ code: e.code, message: e.message })));
    if (hex.bytes.length === 0) return { report: result };
    bytes = hex.bytes;
  }
  const decoded = decodeBank(bytes);
  result.errors.push(...decoded.errors.map((e) => ({ code: e.code, message: e.message })));
  if (decoded.crc) result.crc = { stored: hex32(decoded.crc.stored), computed: hex32(decoded.crc.computed), ok: decoded.crc.stored === decoded.crc.computed };
  result.slotCount = decoded.slotCount;
  if (decoded.formatVersion === undefined || !decoded.crc) return { report: result, decoded };
  const image = imageBytes(bytes, decoded);
  if (image) {
    result.imageSha256 = imageSha256(image);
    const build = matchBuild(result.imageSha256, input.builds);
    if (build) result.build = { buildId: build.buildId, version: build.version, stage: build.stage, ...(build.boardModelName ? { boardModelName: build.boardModelName } : {}) };
  }
  result.slots = identifySlots(bytes, decoded, input.known);
  for (const s of result.slots) {
    if (s.match === "altered") result.faults.push(`Slot ${s.slotIndex + 1} claims v${s.version} but is altered: ${s.differences.join("; ")}.`);
    if (s.match === "undecodable") result.faults.push(`Slot ${s.slotIndex + 1} cannot be read: ${s.reason ?? "damaged"}`);
    for (const f of s.findings) if (f.severity === "error") result.faults.push(`Slot ${s.slotIndex + 1} breaks a safety rule (${f.code}): ${f.message}`);
  }
  const hexBad = result.hex ? !result.hex.ok : false;
  // Status is about the bytes' integrity; what the intact bytes mean is in slots and faults.
  result.status = decoded.ok && !hexBad ? "ok" : "corrupt";
  return { report: result, image, decoded };
}
