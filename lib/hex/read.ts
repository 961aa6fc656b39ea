import {
  RECORD_DATA,
  RECORD_EOF,
  RECORD_EXTENDED_LINEAR,
  RECORD_EXTENDED_SEGMENT,
  RECORD_START_LINEAR,
  RECORD_START_SEGMENT,
} from "./record";

/** A problem in an Intel HEX file, with its 1-based line. */
export interface HexIssue {
  code: string;
  line: number;
  message: string;
}

export interface ReadHexResult {
  ok: boolean;
  /** Lowest address that holds data (undefined when there is none). */
  startAddress?: number;
  /** Data from startAddress to the highest address, gaps filled with 0xFF (erased memory). */
  bytes: Uint8Array;
  /** Records read. */
  recordCount: number;
  sawEof: boolean;
  errors: HexIssue[];
}

/** Largest span between lowest and highest data address accepted (16 MiB). */
export const MAX_HEX_SPAN_BYTES = 16 * 1024 * 1024;
const MAX_ERRORS = 50;

function parseRecordBytes(body: string): number[] | null {
  if (body.length % 2 !== 0 || !/^[0-9A-Fa-f]*$/.test(body)) return null;
  const out: number[] = [];
  for (let i = 0; i < body.length; i += 2) out.push(parseInt(body.slice(i, i + 2), 16));
  return out;
}

/**
 * Reads Intel HEX text (Intel, "Hexadecimal Object File Format Specification",
 * Rev. A): verifies each record's length and checksum (all bytes of a record
 * sum to 0 mod 256), applies type-02 extended segment (base = value·16) and
 * type-04 extended linear (base = value·65536) addresses, accepts and ignores
 * start-address records 03/05, and stops at the type-01 end-of-file record.
 * Errors name the line. Never throws.
 */
export function readIntelHex(text: string): ReadHexResult {
  const errors: HexIssue[] = [];
  const chunks: { address: number; data: number[] }[] = [];
  let base = 0;
  let recordCount = 0;
  let sawEof = false;
  const add = (line: number, code: string, message: string): void => {
    if (errors.length < MAX_ERRORS) errors.push({ code, line, message });
  };
  const empty = (): ReadHexResult => ({ ok: false, bytes: new Uint8Array(0), recordCount, sawEof, errors });
  if (typeof text !== "string") {
    add(0, "hex.not_text", "Expected Intel HEX as text.");
    return empty();
  }
  const lines = text.split(/\r?\n/);
  for (let n = 0; n < lines.length && errors.length < MAX_ERRORS; n++) {
    const lineNo = n + 1;
    const line = lines[n]!.trim();
    if (line === "") continue;
    if (sawEof) {
      add(lineNo, "hex.after_eof", `Line ${lineNo}: records after the end-of-file record; remove them.`);
      break;
    }
    if (!line.startsWith(":")) {
      add(lineNo, "hex.no_start_code", `Line ${lineNo}: a record must start with ":".`);
      continue;
    }
    const bytes = parseRecordBytes(line.slice(1));
    if (bytes === null || bytes.length < 5) {
      add(lineNo, "hex.bad_characters", `Line ${lineNo}: a record is ":" then pairs of hex digits (at least 5 bytes).`);
      continue;
    }
    const [len, hiAddr, loAddr, type] = bytes as [number, number, number, number];
    if (bytes.length !== len + 5) {
      add(lineNo, "hex.bad_length", `Line ${lineNo}: the record says ${len} data bytes but holds ${bytes.length - 5}.`);
      continue;
    }
    const sum = bytes.reduce((s, b) => (s + b) & 0xff, 0);
    if (sum !== 0) {
      const stored = bytes[bytes.length - 1]!;
      const want = (stored - sum + 0x100) & 0xff;
      add(lineNo, "hex.bad_checksum", `Line ${lineNo}: checksum 0x${stored.toString(16).toUpperCase().padStart(2, "0")} is wrong, the record's bytes need 0x${want.toString(16).toUpperCase().padStart(2, "0")}; the file is damaged.`);
      continue;
    }
    recordCount++;
    const data = bytes.slice(4, 4 + len);
    const offset = (hiAddr << 8) | loAddr;
    if (type === RECORD_DATA) {
      if (offset + len > 0x10000) add(lineNo, "hex.offset_wraps", `Line ${lineNo}: the data runs past the 64 KiB segment.`);
      else chunks.push({ address: base + offset, data });
    } else if (type === RECORD_EOF) {
      sawEof = true;
    } else if (type === RECORD_EXTENDED_LINEAR || type === RECORD_EXTENDED_SEGMENT) {
      if (len !== 2) {
        add(lineNo, "hex.bad_length", `Line ${lineNo}: an address record holds 2 data bytes.`);
        continue;
      }
      const value = (data[0]! << 8) | data[1]!;
      base = type === RECORD_EXTENDED_LINEAR ? value * 0x10000 : value * 16;
    } else if (type !== RECORD_START_LINEAR && type !== RECORD_START_SEGMENT) {
      add(lineNo, "hex.unknown_type", `Line ${lineNo}: record type ${type} is not one of 00–05.`);
    }
  }
  if (!sawEof && errors.length === 0) add(lines.length, "hex.no_eof", "The file ends without the end-of-file record :00000001FF; it may be cut short.");
  if (chunks.length === 0) {
    if (errors.length === 0) add(1, "hex.no_data", "The file holds no data records.");
    return empty();
  }
  let lo = Infinity;
  let hi = -Infinity;
  for (const c of chunks) {
    lo = Math.min(lo, c.address);
    hi = Math.max(hi, c.address + c.data.length);
  }
  if (hi - lo > MAX_HEX_SPAN_BYTES) {
    add(1, "hex.span_too_large", `The data spans ${hi - lo} bytes; at most ${MAX_HEX_SPAN_BYTES} are read.`);
    return empty();
  }
  const out = new Uint8Array(hi - lo).fill(0xff);
  for (const c of chunks) out.set(c.data, c.address - lo);
  return { ok: errors.length === 0, startAddress: lo, bytes: out, recordCount, sawEof, errors };
}
