import { decodeBank } from "../bank/decode";
import { DUTY_STEP_PCT, HYSTERESIS_STEP_C, MAX_TEMP_CODE, RAMP_STEP_PCT_PER_SEC, TEMP_STEP_C } from "../bank/layout";
import { sha256, toHex } from "../checksums/sha256";
import type { SlotCodes } from "./codes";
import { DECI_C_PER_TEMP_CODE, runTrace, SENSOR_GLITCH_TICKS, steadyDutyCodes, TICK_MS } from "./control";
import { slotTraces } from "./traces";

/** Identifies the file; `formatVersion` changes when a field changes meaning. */
export const VECTORS_FORMAT = "loopkeeper-firmware-vectors";
export const VECTORS_FORMAT_VERSION = 1;

export interface TraceVector {
  name: string;
  description: string;
  /** One reading per tick, 0.1 °C; null = no reading from the sensor. */
  tempDeciC: (number | null)[];
  /** Expected output per tick, duty codes (× 0.5 %); fans 0 while stopped. */
  pumpDutyCode: number[];
  fanDutyCode: number[];
}

export interface SlotVectors {
  index: number;
  /** Byte offset of the slot in the image. */
  offset: number;
  version: string;
  contentHashPrefix: string;
  /** The stored integer codes (docs/bank-format.md). */
  codes: SlotCodes;
  /** Steady state at every stored temperature code 0–200 (0–100 °C in 0.5 °C steps). */
  sweep: { tempCode: number[]; pumpDutyCode: number[]; fanDutyCode: number[] };
  traces: TraceVector[];
}

export interface FirmwareVectors {
  format: typeof VECTORS_FORMAT;
  formatVersion: typeof VECTORS_FORMAT_VERSION;
  /** The fixed-point rules the expected values follow (docs/firmware-vectors.md). */
  arithmetic: {
    tickMs: number;
    readingStepC: number;
    tempCodeStepC: number;
    dutyCodeStepPct: number;
    hysteresisCodeStepC: number;
    rampCodeStepPctPerSec: number;
    interpolationRounding: "up";
    sensorGlitchTicks: number;
    reference: string;
  };
  bank: { byteLength: number; crc32: number; sha256: string; hex: string };
  slots: SlotVectors[];
}

export type VectorsResult = { ok: true; vectors: FirmwareVectors } | { ok: false; errors: { code: string; message: string }[] };

function sweep(codes: SlotCodes): SlotVectors["sweep"] {
  const out: SlotVectors["sweep"] = { tempCode: [], pumpDutyCode: [], fanDutyCode: [] };
  for (let code = 0; code <= MAX_TEMP_CODE; code++) {
    const d = steadyDutyCodes(codes, code * DECI_C_PER_TEMP_CODE);
    out.tempCode.push(code);
    out.pumpDutyCode.push(d.pumpDutyCode);
    out.fanDutyCode.push(d.fanDutyCode);
  }
  return out;
}

/**
 * Firmware test vectors of a bank image, read from its bytes: for each slot the
 * stored codes, the steady duty codes at every stored temperature, and transient
 * traces (one reading per tick → expected duty codes with hysteresis, ramp limits,
 * fan stop, critical override and sensor dropouts), all from the integer control
 * law in lib/firmware/control.ts. Refuses an image that does not decode cleanly.
 */
export function bankVectors(bytes: Uint8Array): VectorsResult {
  const decoded = decodeBank(bytes);
  if (!decoded.ok || decoded.byteLength === undefined || !decoded.crc) {
    return { ok: false, errors: decoded.errors.length > 0 ? decoded.errors.map((e) => ({ code: e.code, message: e.message })) : [{ code: "bank.unreadable", message: "The image is not a sound bank." }] };
  }
  const image = bytes.subarray(0, decoded.byteLength);
  const slots = decoded.slots.map((slot): SlotVectors => {
    // The walk's seed is the slot's content label, so the same slot always gets the same trace.
    const seed = parseInt(slot.contentHashPrefix.slice(0, 8), 16);
    const traces = slotTraces(slot.codes, seed).map((t): TraceVector => {
      const out = runTrace(slot.codes, t.tempsDeciC);
      return { name: t.name, description: t.description, tempDeciC: t.tempsDeciC, pumpDutyCode: out.map((o) => o.pumpDutyCode), fanDutyCode: out.map((o) => o.fanDutyCode) };
    });
    return { index: slot.index, offset: slot.offset, version: slot.version, contentHashPrefix: slot.contentHashPrefix, codes: slot.codes, sweep: sweep(slot.codes), traces };
  });
  return {
    ok: true,
    vectors: {
      format: VECTORS_FORMAT,
      formatVersion: VECTORS_FORMAT_VERSION,
      arithmetic: {
        tickMs: TICK_MS,
        readingStepC: 0.1,
        tempCodeStepC: TEMP_STEP_C,
        dutyCodeStepPct: DUTY_STEP_PCT,
        hysteresisCodeStepC: HYSTERESIS_STEP_C,
        rampCodeStepPctPerSec: RAMP_STEP_PCT_PER_SEC,
        interpolationRounding: "up",
        sensorGlitchTicks: SENSOR_GLITCH_TICKS,
        reference: "docs/firmware-vectors.md",
      },
      bank: { byteLength: image.length, crc32: decoded.crc.stored, sha256: toHex(sha256(image)), hex: toHex(image) },
      slots,
    },
  };
}

/** The vectors as the file the command line writes and the API serves: indented, number arrays on one line. */
export function vectorsJson(vectors: FirmwareVectors): string {
  const text = JSON.stringify(vectors, null, 2).replace(/\[\s*((?:-?\d+|null)(?:,\s*(?:-?\d+|null))*)\s*\]/g, (_m, inner: string) => `[${inner.replace(/\s+/g, "")}]`);
  return `${text}\n`;
}
