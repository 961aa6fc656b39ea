/**
 * Board serial numbers (docs/serials.md): the board model's prefix, a dash and a
 * zero-padded decimal number, e.g. TC1-00012345. Pure: used by the lookup box,
 * the lot form, CSV import and the API.
 */

/** Digits of the number part; lots never run past 99,999,999 boards per model. */
export const SERIAL_DIGITS = 8;
export const MAX_SERIAL_NUMBER = 10 ** SERIAL_DIGITS - 1;
/** A prefix is 2–8 capital letters or digits, starting with a letter. */
export const SERIAL_PREFIX_RE = /^[A-Z][A-Z0-9]{1,7}$/;

export interface Serial {
  prefix: string;
  number: number;
}

export type ParsedSerial = { ok: true; serial: Serial } | { ok: false; message: string };

const SERIAL_RE = /^([A-Za-z][A-Za-z0-9]{1,7})-(\d{1,8})$/;

/**
 * Reads a serial number as a person types it: surrounding spaces are ignored and
 * the prefix is not case-sensitive; the number may be given without its leading
 * zeros. Anything else is refused with a message that says what a serial looks like.
 */
export function parseSerial(text: string): ParsedSerial {
  const trimmed = typeof text === "string" ? text.trim() : "";
  const m = SERIAL_RE.exec(trimmed);
  if (!m) {
    return { ok: false, message: `"${trimmed.slice(0, 40)}" is not a serial number. A serial is the board's prefix, a dash and up to ${SERIAL_DIGITS} digits, e.g. TC1-00012345.` };
  }
  return { ok: true, serial: { prefix: m[1]!.toUpperCase(), number: Number(m[2]) } };
}

/** The canonical text of a serial: prefix, dash, number zero-padded to 8 digits. */
export function formatSerial(prefix: string, serialNumber: number): string {
  if (!SERIAL_PREFIX_RE.test(prefix)) throw new RangeError(`Serial prefix "${prefix}" must be 2–8 capital letters or digits starting with a letter.`);
  if (!Number.isSafeInteger(serialNumber) || serialNumber < 0 || serialNumber > MAX_SERIAL_NUMBER) {
    throw new RangeError(`Serial number ${serialNumber} must be a whole number from 0 to ${MAX_SERIAL_NUMBER}.`);
  }
  return `${prefix}-${String(serialNumber).padStart(SERIAL_DIGITS, "0")}`;
}

/** Boards in a lot's inclusive serial range. */
export function serialCount(from: number, to: number): number {
  return to - from + 1;
}

/** Inclusive ranges [a1, a2] and [b1, b2] share at least one serial. */
export function rangesOverlap(a1: number, a2: number, b1: number, b2: number): boolean {
  return a1 <= b2 && b1 <= a2;
}
