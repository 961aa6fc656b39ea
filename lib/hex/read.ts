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

/**
 * A start-address record (type 03: CS:IP for 8086-style parts; type 05: a
 * 32-bit entry point). It names where execution starts, not where data goes,
 * so it changes no byte; it is reported so a reader can see the file carries one.
 */
export interface HexStartRecord {
  line: number;
  type: 3 | 5;
  /** Type 03: code segment. */
  segment?: number;
  /** Type 03: instruction pointer. */
  offset?: number;
  /** Type 05: the 32-bit linear start address. */
  linearAddress?: number;
}

export interface ReadHexResult {
  ok: boolean;
  /** Start-address records found (types 03 and 05), in file order. */
  startRecords: HexStartRecord[];
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

const hex8 = (n: number): string => `0x${n.toString(16).toUpperCase().padStart(8, "0")}`;

/**
 * Two data records that write the same byte: the file does not say which one the
 * programmer should keep, so both lines are named. Sorted by address, each record
 * is compared with the one reaching furthest so far, so n records cost n·log n.
 */
function overlapErrors(chunks: readonly { address: number; data: number[]; line: number }[], add: (line: number, code: string, message: string) => void): void {
  const sorted = [...chunks].sort((a, b) => a.address - b.address || a.line - b.line);
  let reach: { end: number; line: number } | null = null;
  for (const c of sorted) {
    if (reach && c.address < reach.end) {
      const [first, second] = reach.line < c.line ? [reach.line, c.line] : [c.line, reach.line];
      const overlapEnd = Math.min(reach.end, c.address + c.data.length);
      add(second, "hex.overlap", `Lines ${first} and ${second} both write address ${hex8(c.address)}${overlapEnd - c.address > 1 ? `–${hex8(overlapEnd - 1)}` : ""}; each address may be given once, so remove or fix one of them.`);
    }
    const end = c.address + c.data.length;
    if (!reach || end > reach.end) reach = { end, line: c.line };
  }
}

/**
 * Reads Intel HEX text (Intel, "Hexadecimal Object File Format Specification",
 * Rev. A): verifies each record's length and checksum (all bytes of a record
 * sum to 0 mod 256), applies type-02 extended segment (base = value·16) and
 * type-04 extended linear (base = value·65536) addresses, reports start-address
 * records 03/05 (they place no data), and stops at the type-01 end-of-file record.
 * Strict where a lenient reader would guess: two records that write the same
 * address (the later would silently win), any record after end-of-file, and
 * end-of-file, address or start records of the wrong length are refused.
 * Errors name the line (both lines for an overlap). Never throws.
 */
export function readIntelHex(text: string): ReadHexResult {
  const errors: HexIssue[] = [];
  const chunks: { address: number; data: number[]; line: number }[] = [];
  const startRecords: HexStartRecord[] = [];
  let base = 0;
  let recordCount = 0;
  let sawEof = false;
  const add = (line: number, code: string, message: string): void => {
    if (errors.length < MAX_ERRORS) errors.push({ code, line, message });
  };
  const empty = (): ReadHexResult => ({ ok: false, bytes: new Uint8Array(0), recordCount, sawEof, errors, startRecords });
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
      add(lineNo, "hex.after_eof", `Line ${lineNo}: there is more after the end-of-file record; a HEX file ends with it, so remove what follows or re-export the file.`);
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
      else if (len > 0) chunks.push({ address: base + offset, data, line: lineNo });
    } else if (type === RECORD_EOF) {
      if (len !== 0) {
        add(lineNo, "hex.bad_eof", `Line ${lineNo}: the end-of-file record carries ${len} data byte(s); it must be exactly :00000001FF.`);
        continue;
      }
      sawEof = true;
    } else if (type === RECORD_EXTENDED_LINEAR || type === RECORD_EXTENDED_SEGMENT) {
      if (len !== 2) {
        add(lineNo, "hex.bad_length", `Line ${lineNo}: an extended ${type === RECORD_EXTENDED_LINEAR ? "linear" : "segment"} address record holds exactly 2 data bytes, this one ${len}.`);
        continue;
      }
      const value = (data[0]! << 8) | data[1]!;
      base = type === RECORD_EXTENDED_LINEAR ? value * 0x10000 : value * 16;
    } else if (type === RECORD_START_LINEAR || type === RECORD_START_SEGMENT) {
      if (len !== 4) {
        add(lineNo, "hex.bad_length", `Line ${lineNo}: a start-address record holds exactly 4 data bytes, this one ${len}.`);
        continue;
      }
      const hi = (data[0]! << 8) | data[1]!;
      const lo = (data[2]! << 8) | data[3]!;
      startRecords.push(type === RECORD_START_SEGMENT ? { line: lineNo, type: 3, segment: hi, offset: lo } : { line: lineNo, type: 5, linearAddress: hi * 0x10000 + lo });
    } else {
      add(lineNo, "hex.unknown_type", `Line ${lineNo}: record type ${type} is not one of 00–05.`);
    }
  }
  overlapErrors(chunks, add);
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
  return { ok: errors.length === 0, startAddress: lo, bytes: out, recordCount, sawEof, errors, startRecords };
}
