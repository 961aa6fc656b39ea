import { readIntelHex } from "../engine";
import { hasMeasurementHeader, parseMeasurementsCsv } from "./measurements";
import { UPLOAD_KINDS, UPLOAD_LABELS, UPLOAD_MAX_BYTES, PENDING_UPLOAD_HOURS, PENDING_UPLOAD_QUOTA_BYTES, type UploadKind } from "./upload-limits";

export { UPLOAD_KINDS, UPLOAD_LABELS, UPLOAD_MAX_BYTES, PENDING_UPLOAD_HOURS, PENDING_UPLOAD_QUOTA_BYTES, type UploadKind };

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

/** The extension a checked content type downloads with: the stored name never decides how a file opens. */
const EXTENSION_OF: Record<string, string> = { "application/pdf": ".pdf", "text/csv": ".csv", "text/x-hex": ".hex", "application/octet-stream": ".bin" };

/**
 * The file name a download is offered under: the uploaded name reduced to safe characters,
 * with its extension replaced by the one of the type judged from the content (a PDF uploaded
 * as `report.html` downloads as `report.pdf`).
 */
export function downloadName(originalName: string, contentType: string): string {
  const safe = originalName.replace(/[^A-Za-z0-9._ -]/g, "_").slice(0, 120).trim();
  const ext = EXTENSION_OF[contentType] ?? ".bin";
  const stem = safe.replace(/\.[A-Za-z0-9]{1,8}$/, "").replace(/^\.+/, "") || "download";
  return `${stem}${ext}`;
}
