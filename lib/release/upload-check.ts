import { readIntelHex } from "../engine";
import { hasMeasurementHeader, parseMeasurementsCsv } from "./measurements";

export const UPLOAD_KINDS = ["firmware", "lab_report", "measurements"] as const;
export type UploadKind = (typeof UPLOAD_KINDS)[number];

/** Largest accepted file per kind, bytes. */
export const UPLOAD_MAX_BYTES: Record<UploadKind, number> = {
  firmware: 2 * 1024 * 1024,
  lab_report: 10 * 1024 * 1024,
  measurements: 512 * 1024,
};

export const UPLOAD_LABELS: Record<UploadKind, string> = {
  firmware: "Firmware image (.bin or Intel HEX .hex)",
  lab_report: "Lab report (PDF)",
  measurements: "Measurements (CSV)",
};

/**
 * A file name is kept only as a label, never as a path; names that try to be a path or
 * carry control characters are refused so nobody is misled by them later.
 */
export function uploadNameProblem(name: string): string | null {
  if (!name.trim()) return "Give the file's name.";
  if (name.length > 200) return "The file name is longer than 200 characters; rename the file.";
  // eslint-disable-next-line no-control-regex
  if (/[\u0000-\u001f\u007f]/.test(name)) return "The file name contains control characters; rename the file.";
  if (/[\\/]/.test(name) || name.includes("..") || /^[a-z]:/i.test(name)) return "The file name must be a plain name without folders or \"..\"; rename the file.";
  return null;
}

const startsWith = (bytes: Uint8Array, text: string) => bytes.length >= text.length && [...text].every((c, i) => bytes[i] === c.charCodeAt(0));

function asText(bytes: Uint8Array): string | null {
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    return null;
  }
}

export type UploadContentCheck = { ok: true; contentType: string } | { ok: false; message: string };

/**
 * The type of an upload judged by its content, not its name: PDF by its "%PDF-" magic
 * bytes, the measurement CSV by its header, firmware either as Intel HEX text (every
 * record parsed and checksummed) or as a raw binary image of any bytes.
 */
export function checkUploadContent(kind: UploadKind, name: string, bytes: Uint8Array): UploadContentCheck {
  if (bytes.length === 0) return { ok: false, message: "The file is empty." };
  if (kind === "lab_report") {
    return startsWith(bytes, "%PDF-") ? { ok: true, contentType: "application/pdf" } : { ok: false, message: "The lab report must be a PDF file (it does not start with %PDF-)." };
  }
  if (kind === "measurements") {
    const text = asText(bytes);
    if (text === null || !hasMeasurementHeader(text)) {
      return { ok: false, message: "The measurements must be a CSV text file whose first line is liquid_temp_c,pump_rpm,fan_rpm,sound_dba (optionally followed by ,background_dba)." };
    }
    return { ok: true, contentType: "text/csv" };
  }
  const looksHex = /\.hex$/i.test(name) || bytes[0] === 0x3a;
  if (!looksHex) return { ok: true, contentType: "application/octet-stream" };
  const text = asText(bytes);
  const parsed = text === null ? null : readIntelHex(text);
  if (!parsed?.ok) {
    const first = parsed?.errors[0];
    return { ok: false, message: `The firmware looks like Intel HEX but does not parse${first ? `: line ${first.line}: ${first.message}` : " as text"}.` };
  }
  return { ok: true, contentType: "text/x-hex" };
}

/**
 * Row problems of a file whose type already passed `checkUploadContent`: a measurement CSV
 * must read completely (every row numeric and in range) before it is stored, so a file the
 * gate cannot use is never shown as attached. Empty when the file is fine.
 */
export function uploadRowErrors(kind: UploadKind, bytes: Uint8Array): string[] {
  if (kind !== "measurements") return [];
  const parsed = parseMeasurementsCsv(new TextDecoder().decode(bytes));
  return parsed.ok ? [] : parsed.errors;
}
