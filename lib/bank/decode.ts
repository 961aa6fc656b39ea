import { crc32 } from "../checksums/crc32";
import { hex32 } from "../hex/address";
import { toHex } from "../checksums/sha256";
import type { CurveSettings, FanCurve, ProfileSettings } from "../profile/types";
import {
  BANK_FORMAT_VERSION,
  BANK_MAGIC,
  BYTES_PER_POINT,
  CRC_BYTES,
  CURVE_FIXED_BYTES,
  HASH_PREFIX_BYTES,
  HEADER_BYTES,
  MAX_DUTY_CODE,
  MAX_HYSTERESIS_CODE,
  MAX_RAMP_CODE,
  MAX_SLOTS,
  MAX_TEMP_CODE,
  NO_FAN_STOP,
  SLOT_FIXED_BYTES,
} from "./layout";
import { dutyFromCode, hysteresisFromCode, rampFromCode, tempFromCode } from "./quantise";
import type { CurveCodes } from "../firmware/codes";
import { parseSignatureBlock, SIGNATURE_BLOCK_BYTES } from "../signing/signature-block";
import type { BankIssue, DecodeBankResult, DecodedSlot } from "./types";

/** Smallest slot: fixed fields and two curves of one point each. */
const MIN_SLOT_BYTES = SLOT_FIXED_BYTES + 2 * (CURVE_FIXED_BYTES + BYTES_PER_POINT);
/** What erased EEPROM or flash reads as. */
const ERASED_BYTE = 0xff;


class SlotReader {
  constructor(
    private readonly bytes: Uint8Array,
    public at: number,
    private readonly end: number,
    private readonly errors: BankIssue[],
    private readonly slotIndex: number,
  ) {}

  /** Next byte, or null (with an error) past the slot end. */
  byte(): number | null {
    if (this.at >= this.end) {
      this.errors.push({ code: "bank.slot_truncated", message: `Slot ${this.slotIndex + 1} ends at byte ${this.end} but its contents go on; the image is damaged.`, offset: this.at });
      return null;
    }
    return this.bytes[this.at++]!;
  }

  /** Next byte that must be ≤ max (and ≥ min). */
  code(field: string, max: number, min = 0): number | null {
    const offset = this.at;
    const v = this.byte();
    if (v === null) return null;
    if (v > max || v < min) {
      this.errors.push({ code: "bank.value_out_of_range", message: `Slot ${this.slotIndex + 1}: ${field} byte ${v} at offset ${offset} is outside ${min}–${max}.`, offset, actual: v });
      return null;
    }
    return v;
  }
}

function readCurve(r: SlotReader, name: string): { settings: CurveSettings; codes: CurveCodes } | null {
  const count = r.code(`${name} point count`, 255, 1);
  const hyst = r.code(`${name} hysteresis`, MAX_HYSTERESIS_CODE);
  const up = r.code(`${name} ramp-up`, MAX_RAMP_CODE, 1);
  const down = r.code(`${name} ramp-down`, MAX_RAMP_CODE, 1);
  if (count === null || hyst === null || up === null || down === null) return null;
  const points = [];
  const pointCodes = [];
  for (let i = 0; i < count; i++) {
    const t = r.code(`${name} point ${i} temperature`, MAX_TEMP_CODE);
    const d = r.code(`${name} point ${i} duty`, MAX_DUTY_CODE);
    if (t === null || d === null) return null;
    points.push({ tempC: tempFromCode(t), dutyPct: dutyFromCode(d) });
    pointCodes.push({ tempCode: t, dutyCode: d });
  }
  return {
    settings: { points, hysteresisC: hysteresisFromCode(hyst), rampUpPctPerSec: rampFromCode(up), rampDownPctPerSec: rampFromCode(down) },
    codes: { hysteresisCode: hyst, rampUpCode: up, rampDownCode: down, points: pointCodes },
  };
}

function readSlot(bytes: Uint8Array, offset: number, limit: number, index: number, errors: BankIssue[]): { slot: DecodedSlot | null; next: number } {
  const length = bytes[offset]!;
  const minLength = MIN_SLOT_BYTES;
  if (length < minLength || offset + length > limit) {
    errors.push({ code: "bank.bad_slot_length", message: `Slot ${index + 1} at offset ${offset} says it is ${length} bytes, which does not fit the image (${minLength} bytes at least, ${limit - offset} left).`, offset, actual: length });
    return { slot: null, next: limit };
  }
  const end = offset + length;
  const r = new SlotReader(bytes, offset + 1, end, errors, index);
  const hash = toHex(bytes.subarray(offset + 1, offset + 1 + HASH_PREFIX_BYTES));
  r.at += HASH_PREFIX_BYTES;
  const version = `${r.byte()}.${r.byte()}.${r.byte()}`;
  const critical = r.code("critical temperature", MAX_TEMP_CODE);
  const sensorLoss = r.code("sensor-loss duty", MAX_DUTY_CODE);
  const stop = r.byte();
  const stopOk = stop === NO_FAN_STOP || (stop !== null && stop <= MAX_TEMP_CODE);
  if (!stopOk && stop !== null) errors.push({ code: "bank.value_out_of_range", message: `Slot ${index + 1}: fan stop byte ${stop} is neither 0xFF (none) nor 0–${MAX_TEMP_CODE}.`, offset: r.at - 1, actual: stop });
  const pump = readCurve(r, "pump");
  const fansCurve = pump ? readCurve(r, "fan") : null;
  if (critical === null || sensorLoss === null || !stopOk || pump === null || fansCurve === null) return { slot: null, next: end };
  if (r.at !== end) {
    errors.push({ code: "bank.bad_slot_length", message: `Slot ${index + 1} says it is ${length} bytes but its contents take ${r.at - offset}.`, offset, expected: length, actual: r.at - offset });
    return { slot: null, next: end };
  }
  const fans: FanCurve = stop === NO_FAN_STOP ? fansCurve.settings : { ...fansCurve.settings, stopBelowTempC: tempFromCode(stop) };
  const settings: ProfileSettings = { criticalTempC: tempFromCode(critical), sensorLossDutyPct: dutyFromCode(sensorLoss), pump: pump.settings, fans };
  const codes = { criticalTempCode: critical, sensorLossDutyCode: sensorLoss, fanStopTempCode: stop === NO_FAN_STOP ? null : stop, pump: pump.codes, fans: fansCurve.codes };
  return { slot: { index, offset, contentHashPrefix: hash, version, settings, codes }, next: end };
}

/**
 * Reads a bank image (or a memory dump that starts with one; bytes after the
 * length the header gives must be erased memory, 0xFF). Checks magic, format
 * version, length, slot count (1–16 and no more than the length has room
 * for), CRC-32 trailer (stored vs computed) and every slot's bounds and value
 * ranges. Never throws: problems come back in `errors`, and slots that could
 * be read are returned even when the CRC does not match.
 */
export function decodeBank(bytes: Uint8Array): DecodeBankResult {
  const errors: BankIssue[] = [];
  const result: DecodeBankResult = { ok: false, slots: [], undecodable: [], errors };
  if (!(bytes instanceof Uint8Array)) {
    errors.push({ code: "bank.not_bytes", message: "Expected the image as bytes (Uint8Array)." });
    return result;
  }
  if (bytes.length < HEADER_BYTES + CRC_BYTES) {
    errors.push({ code: "bank.truncated", message: `The image is ${bytes.length} bytes; a bank has at least ${HEADER_BYTES + CRC_BYTES}.`, expected: HEADER_BYTES + CRC_BYTES, actual: bytes.length });
    return result;
  }
  for (let i = 0; i < BANK_MAGIC.length; i++) {
    if (bytes[i] !== BANK_MAGIC[i]) {
      errors.push({ code: "bank.bad_magic", message: `Bytes 0–3 are ${toHex(bytes.subarray(0, 4))}, not the bank magic ${toHex(BANK_MAGIC)} ("LKPB"): this is not a profile bank, or it starts at another address.`, offset: 0 });
      return result;
    }
  }
  result.formatVersion = bytes[4]!;
  result.slotCount = bytes[5]!;
  const byteLength = bytes[6]! | (bytes[7]! << 8);
  result.byteLength = byteLength;
  if (result.formatVersion !== BANK_FORMAT_VERSION) {
    errors.push({ code: "bank.unsupported_format", message: `Format version ${result.formatVersion} is not supported (this tool reads ${BANK_FORMAT_VERSION}).`, offset: 4, expected: BANK_FORMAT_VERSION, actual: result.formatVersion });
    return result;
  }
  if (byteLength < HEADER_BYTES + CRC_BYTES) {
    errors.push({ code: "bank.bad_length", message: `The header gives a length of ${byteLength} bytes, less than the ${HEADER_BYTES + CRC_BYTES} of an empty bank.`, offset: 6, actual: byteLength });
    return result;
  }
  if (byteLength > bytes.length) {
    errors.push({ code: "bank.truncated", message: `The header gives ${byteLength} bytes but only ${bytes.length} are present: the dump is cut short.`, offset: bytes.length, expected: byteLength, actual: bytes.length });
    return result;
  }
  const crcAt = byteLength - CRC_BYTES;
  const stored = (bytes[crcAt]! | (bytes[crcAt + 1]! << 8) | (bytes[crcAt + 2]! << 16) | (bytes[crcAt + 3]! << 24)) >>> 0;
  const computed = crc32(bytes, 0, 0, crcAt);
  result.crc = { stored, computed };
  if (stored !== computed) {
    errors.push({ code: "bank.crc_mismatch", message: `CRC-32 mismatch: the image stores ${hex32(stored)} at offset ${crcAt} but its bytes give ${hex32(computed)}; the image is damaged.`, offset: crcAt, expected: stored, actual: computed });
  }
  // A board with room keeps the image's signature block right after the CRC (docs/bank-format.md, "Signature").
  const storedSignature = parseSignatureBlock(bytes, byteLength);
  if (storedSignature.ok) result.signatureBlock = storedSignature.block;
  const afterImage = storedSignature.ok ? byteLength + SIGNATURE_BLOCK_BYTES : byteLength;
  const erased = bytes.subarray(afterImage).findIndex((b) => b !== ERASED_BYTE);
  if (erased !== -1) {
    const at = afterImage + erased;
    errors.push({ code: "bank.trailing_data", message: `Byte ${at} after the bank's CRC holds 0x${bytes[at]!.toString(16).toUpperCase().padStart(2, "0")}; past the image the memory must be erased (0xFF). The header's length is wrong or something else was written there.`, offset: at, expected: ERASED_BYTE, actual: bytes[at] });
  }
  if (result.slotCount === 0) {
    errors.push({ code: "bank.no_slots", message: "The header gives 0 slots; a bank holds at least one profile version.", offset: 5, actual: 0 });
    return result;
  }
  if (result.slotCount > MAX_SLOTS) {
    errors.push({ code: "bank.too_many_slots", message: `The header gives ${result.slotCount} slots; at most ${MAX_SLOTS} are allowed.`, offset: 5, actual: result.slotCount });
    return result;
  }
  const slotRoom = Math.floor((byteLength - HEADER_BYTES - CRC_BYTES) / MIN_SLOT_BYTES);
  if (result.slotCount > slotRoom) {
    errors.push({ code: "bank.slots_exceed_length", message: `The header gives ${result.slotCount} slots, but its length of ${byteLength} bytes has room for at most ${slotRoom} (a slot takes at least ${MIN_SLOT_BYTES} bytes).`, offset: 5, expected: slotRoom, actual: result.slotCount });
    return result;
  }
  let at = HEADER_BYTES;
  for (let i = 0; i < result.slotCount; i++) {
    if (at >= crcAt) {
      const message = `The header gives ${result.slotCount} slots but only ${i} fit before the CRC.`;
      errors.push({ code: "bank.slot_truncated", message, offset: at });
      for (let j = i; j < result.slotCount; j++) result.undecodable.push({ index: j, offset: at, code: "bank.slot_truncated", reason: `Slot ${j + 1} does not fit before the CRC: ${message}` });
      break;
    }
    const before = errors.length;
    const { slot, next } = readSlot(bytes, at, crcAt, i, errors);
    if (slot) result.slots.push(slot);
    else {
      const first = errors[before];
      result.undecodable.push({ index: i, offset: at, code: first?.code ?? "bank.bad_slot", reason: first?.message ?? `Slot ${i + 1} could not be read.` });
    }
    at = next;
  }
  if (errors.length === 0 && at !== crcAt) {
    errors.push({ code: "bank.bad_length", message: `The slots end at byte ${at} but the CRC is at ${crcAt}.`, offset: at, expected: crcAt, actual: at });
  }
  result.ok = errors.length === 0;
  return result;
}
