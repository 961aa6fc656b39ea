/** Intel HEX record types (Intel, "Hexadecimal Object File Format Specification", Rev. A, 1988). */
export const RECORD_DATA = 0x00;
export const RECORD_EOF = 0x01;
export const RECORD_EXTENDED_SEGMENT = 0x02;
export const RECORD_START_SEGMENT = 0x03;
export const RECORD_EXTENDED_LINEAR = 0x04;
export const RECORD_START_LINEAR = 0x05;

/** End-of-file record. */
export const EOF_RECORD = ":00000001FF";

/**
 * Checksum byte of a record: the two's complement of the sum of all its bytes
 * (length, address, type, data) modulo 256, so the whole record sums to 0.
 */
export function recordChecksum(bytes: readonly number[] | Uint8Array): number {
  let sum = 0;
  for (const b of bytes) sum = (sum + b) & 0xff;
  return (0x100 - sum) & 0xff;
}

const hex2 = (n: number): string => n.toString(16).toUpperCase().padStart(2, "0");

/** One record as text: ":" LL AAAA TT DD… CC. */
export function formatRecord(type: number, address16: number, data: Uint8Array | readonly number[]): string {
  const bytes = [data.length, (address16 >> 8) & 0xff, address16 & 0xff, type, ...data];
  return `:${bytes.map(hex2).join("")}${hex2(recordChecksum(bytes))}`;
}
