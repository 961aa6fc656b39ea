import "server-only";
import { decodeBank, identifySlots, readIntelHex } from "@/lib/engine";
import type { DumpIdentifyResult } from "@/lib/api/operations/support";

const hex32 = (n: number) => `0x${n.toString(16).toUpperCase().padStart(8, "0")}`;

/** Intel HEX when the text starts with a record mark; anything else is a raw binary image. */
export function looksLikeIntelHex(bytes: Uint8Array): boolean {
  let i = 0;
  while (i < bytes.length && (bytes[i] === 0x20 || bytes[i] === 0x0a || bytes[i] === 0x0d || bytes[i] === 0x09 || bytes[i] === 0xef || bytes[i] === 0xbb || bytes[i] === 0xbf)) i++;
  return bytes[i] === 0x3a; // ':'
}

export interface KnownVersion {
  profileVersionId: string;
  contentHash: string;
  version: string;
  profileName: string;
  coolerName: string;
}

/**
 * Reads a dump (Intel HEX or binary), checks the bank header and CRC-32 and matches
 * every readable slot to a published profile version by content-hash prefix and
 * version. "corrupt" when the CRC, a record checksum or a slot is damaged.
 */
export function identifyDumpBytes(input: { bytes: Uint8Array; fileName: string | null; known: readonly KnownVersion[] }): DumpIdentifyResult {
  const isHex = looksLikeIntelHex(input.bytes);
  let image = input.bytes;
  const result: DumpIdentifyResult = { fileName: input.fileName, format: isHex ? "hex" : "bin", sizeBytes: input.bytes.length, status: "unreadable", slots: [], errors: [] };
  if (isHex) {
    const hex = readIntelHex(new TextDecoder().decode(input.bytes));
    result.hex = { ok: hex.ok, startAddress: hex.startAddress, recordCount: hex.recordCount, errors: hex.errors.map((e) => ({ line: e.line, message: e.message })) };
    if (hex.bytes.length === 0) {
      result.errors.push(...hex.errors.map((e) => ({ code: e.code, message: e.message })));
      return result;
    }
    image = hex.bytes;
  }
  const decoded = decodeBank(image);
  result.errors.push(...decoded.errors.map((e) => ({ code: e.code, message: e.message })));
  if (decoded.crc) result.crc = { stored: hex32(decoded.crc.stored), computed: hex32(decoded.crc.computed), ok: decoded.crc.stored === decoded.crc.computed };
  result.slotCount = decoded.slotCount;
  if (decoded.formatVersion === undefined || !decoded.crc) return result;
  const byId = new Map(input.known.map((k) => [k.profileVersionId, k]));
  const ids = identifySlots(
    decoded.slots,
    input.known.map((k) => ({ profileVersionId: k.profileVersionId, contentHashPrefix: k.contentHash, version: k.version })),
  );
  result.slots = ids.map((s) => {
    const k = s.profileVersionId ? byId.get(s.profileVersionId) : undefined;
    return { ...s, profileName: k?.profileName, coolerName: k?.coolerName };
  });
  const hexBad = result.hex ? !result.hex.ok : false;
  result.status = decoded.ok && !hexBad ? "ok" : "corrupt";
  return result;
}
