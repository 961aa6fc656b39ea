/**
 * Byte layout of the profile bank, format version 1. docs/bank-format.md
 * describes it byte by byte; change both together.
 */

/** "LKPB": Loopkeeper profile bank. */
export const BANK_MAGIC = new Uint8Array([0x4c, 0x4b, 0x50, 0x42]);
export const BANK_FORMAT_VERSION = 1;
export const HEADER_BYTES = 8;
export const CRC_BYTES = 4;
/** Bytes of the content hash prefix kept per slot. */
export const HASH_PREFIX_BYTES = 8;
/** Slot fields before the pump block: length, hash prefix, version, critical, sensor loss, fan stop. */
export const SLOT_FIXED_BYTES = 1 + HASH_PREFIX_BYTES + 3 + 3;
/** Curve block before its points: point count, hysteresis, ramp up, ramp down. */
export const CURVE_FIXED_BYTES = 4;
export const BYTES_PER_POINT = 2;
/** Fan-stop byte meaning "fans never stop". */
export const NO_FAN_STOP = 0xff;
/** Largest slot count the header can describe and a board may have. */
export const MAX_SLOTS = 16;
/** Largest whole image the 16-bit length field can describe. */
export const MAX_BANK_BYTES = 0xffff;

/** Quantisation steps of the stored values. */
export const TEMP_STEP_C = 0.5;
export const DUTY_STEP_PCT = 0.5;
export const HYSTERESIS_STEP_C = 0.1;
export const RAMP_STEP_PCT_PER_SEC = 0.5;
/** Largest stored byte for a temperature (100 °C) and a duty (100 %). */
export const MAX_TEMP_CODE = 200;
export const MAX_DUTY_CODE = 200;
export const MAX_HYSTERESIS_CODE = 100;
export const MAX_RAMP_CODE = 200;

/** Bytes one slot takes for curves of `pumpPoints` and `fanPoints` points. */
export function slotBytes(pumpPoints: number, fanPoints: number): number {
  return SLOT_FIXED_BYTES + 2 * CURVE_FIXED_BYTES + BYTES_PER_POINT * (pumpPoints + fanPoints);
}

/** Bytes of a whole bank image (header, slots, CRC) for the given slots. */
export function bankBytes(slots: readonly { pumpPoints: number; fanPoints: number }[]): number {
  return HEADER_BYTES + slots.reduce((sum, s) => sum + slotBytes(s.pumpPoints, s.fanPoints), 0) + CRC_BYTES;
}
