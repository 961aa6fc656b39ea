import { contentHashHex } from "../profile/canonical";
import { slotCodes, type CurveCodes } from "../firmware/codes";
import { crc32 } from "../checksums/crc32";
import {
  BANK_FORMAT_VERSION,
  BANK_MAGIC,
  bankBytes,
  CRC_BYTES,
  HASH_PREFIX_BYTES,
  HEADER_BYTES,
  MAX_BANK_BYTES,
  MAX_SLOTS,
  NO_FAN_STOP,
  slotBytes,
} from "./layout";
import type { BankIssue, BankSlotInput, EncodeBankResult } from "./types";
import { storedVersionParts } from "@/lib/versioning/stored-version";

/** Parses "x.y.z" with each part 0–255; null otherwise. */
export const versionBytes = storedVersionParts;

function writeCurve(out: Uint8Array, at: number, curve: CurveCodes): number {
  out[at++] = curve.points.length;
  out[at++] = curve.hysteresisCode;
  out[at++] = curve.rampUpCode;
  out[at++] = curve.rampDownCode;
  for (const p of curve.points) {
    out[at++] = p.tempCode;
    out[at++] = p.dutyCode;
  }
  return at;
}

function checkSlots(slots: readonly BankSlotInput[], memoryBytes: number | undefined): BankIssue[] {
  const errors: BankIssue[] = [];
  if (slots.length === 0) errors.push({ code: "bank.no_slots", message: "Give at least one profile version to put in the bank." });
  if (slots.length > MAX_SLOTS) errors.push({ code: "bank.too_many_slots", message: `A bank holds at most ${MAX_SLOTS} slots; remove ${slots.length - MAX_SLOTS}.` });
  slots.forEach((s, i) => {
    if (!versionBytes(s.version)) {
      errors.push({ code: "bank.version_not_encodable", message: `Slot ${i + 1}: version "${s.version}" must be x.y.z with each part 0–255 and no pre-release or build suffix.` });
    }
    if (s.contentHashHex !== undefined && !/^[0-9a-fA-F]{16,64}$/.test(s.contentHashHex)) {
      errors.push({ code: "bank.bad_content_hash", message: `Slot ${i + 1}: content hash must be 16 to 64 hex digits.` });
    }
    const numbers = [s.profile.criticalTempC, s.profile.sensorLossDutyPct, s.profile.fans.stopBelowTempC ?? 0];
    for (const curve of [s.profile.pump, s.profile.fans]) {
      numbers.push(curve.hysteresisC, curve.rampUpPctPerSec, curve.rampDownPctPerSec);
      for (const p of curve.points) numbers.push(p.tempC, p.dutyPct);
    }
    if (!numbers.every((n) => typeof n === "number" && Number.isFinite(n))) {
      errors.push({ code: "bank.value_not_finite", message: `Slot ${i + 1}: every stored value must be a finite number; validate the profile first.` });
    }
    for (const [name, curve] of [["pump", s.profile.pump], ["fans", s.profile.fans]] as const) {
      if (curve.points.length < 1) {
        errors.push({ code: "bank.bad_point_count", message: `Slot ${i + 1}: the ${name} curve needs at least 1 point.` });
      }
    }
    if (slotBytes(s.profile.pump.points.length, s.profile.fans.points.length) > 255) {
      errors.push({ code: "bank.slot_too_large", message: `Slot ${i + 1}: a slot holds at most 255 bytes; use at most 32 points per curve.` });
    }
  });
  if (errors.length > 0) return errors;
  const size = bankBytes(slots.map((s) => ({ pumpPoints: s.profile.pump.points.length, fanPoints: s.profile.fans.points.length })));
  if (size > MAX_BANK_BYTES) errors.push({ code: "bank.too_large", message: `The image would take ${size} bytes; the format holds at most ${MAX_BANK_BYTES}.` });
  if (memoryBytes !== undefined && size > memoryBytes) {
    errors.push({ code: "bank.exceeds_memory", message: `The image takes ${size} bytes but the board revision has ${memoryBytes}; use fewer slots or fewer curve points.`, expected: memoryBytes, actual: size });
  }
  return errors;
}

/**
 * Encodes profile versions into a bank image (format in docs/bank-format.md):
 * 8-byte header, one slot per profile version with quantised curves (see
 * `quantise`), and a CRC-32 (zlib/IEEE) of all preceding bytes, little-endian,
 * as the last 4 bytes. Returns errors instead of throwing when a version does
 * not fit 3 bytes, a curve is empty, or the image exceeds `memoryBytes`.
 */
export function encodeBank(slots: readonly BankSlotInput[], options: { memoryBytes?: number; slotCount?: number } = {}): EncodeBankResult {
  try {
    return encode(slots, options);
  } catch {
    // Only reached with input that does not have the profile shape (e.g. from untyped callers).
    return { ok: false, errors: [{ code: "bank.bad_input", message: "The slots are not profile versions of the expected shape; validate each profile first." }] };
  }
}

function encode(slots: readonly BankSlotInput[], options: { memoryBytes?: number; slotCount?: number }): EncodeBankResult {
  const errors = checkSlots(slots, options.memoryBytes);
  if (options.slotCount !== undefined && slots.length > options.slotCount) {
    errors.push({ code: "bank.exceeds_slot_count", message: `The board revision has ${options.slotCount} slots; ${slots.length} profile versions were given.` });
  }
  if (errors.length > 0) return { ok: false, errors };

  const size = bankBytes(slots.map((s) => ({ pumpPoints: s.profile.pump.points.length, fanPoints: s.profile.fans.points.length })));
  const out = new Uint8Array(size);
  out.set(BANK_MAGIC, 0);
  out[4] = BANK_FORMAT_VERSION;
  out[5] = slots.length;
  out[6] = size & 0xff;
  out[7] = size >>> 8;
  let at = HEADER_BYTES;
  for (const slot of slots) {
    const { profile } = slot;
    out[at++] = slotBytes(profile.pump.points.length, profile.fans.points.length);
    const hash = (slot.contentHashHex ?? contentHashHex(profile)).slice(0, HASH_PREFIX_BYTES * 2);
    for (let i = 0; i < HASH_PREFIX_BYTES; i++) out[at++] = parseInt(hash.slice(i * 2, i * 2 + 2), 16);
    for (const part of versionBytes(slot.version)!) out[at++] = part;
    // The same integers the as-flashed preview and the firmware vectors are computed from.
    const codes = slotCodes(profile);
    out[at++] = codes.criticalTempCode;
    out[at++] = codes.sensorLossDutyCode;
    out[at++] = codes.fanStopTempCode ?? NO_FAN_STOP;
    at = writeCurve(out, at, codes.pump);
    at = writeCurve(out, at, codes.fans);
  }
  const crc = crc32(out, 0, 0, size - CRC_BYTES);
  new DataView(out.buffer).setUint32(size - CRC_BYTES, crc, true);
  return { ok: true, bytes: out };
}
