/**
 * The kinds of build evidence and their size limits as plain values: upload screens show and
 * check them without loading the content checks (lib/release/upload-check.ts, which reads
 * Intel HEX and measurement CSV through the engine and re-exports these).
 */
export const UPLOAD_KINDS = ["firmware", "lab_report", "measurements"] as const;
export type UploadKind = (typeof UPLOAD_KINDS)[number];

/** Largest accepted file per kind, bytes. */
export const UPLOAD_MAX_BYTES: Record<UploadKind, number> = {
  firmware: 2 * 1024 * 1024,
  lab_report: 10 * 1024 * 1024,
  measurements: 512 * 1024,
};

/**
 * Upload housekeeping policy. An upload that no build refers to is "pending": each person may
 * hold at most `PENDING_UPLOAD_QUOTA_BYTES` of them, and they are removed (row and stored
 * bytes) `PENDING_UPLOAD_HOURS` after they arrived. Files a build refers to are kept.
 */
export const PENDING_UPLOAD_QUOTA_BYTES = 64 * 1024 * 1024;
export const PENDING_UPLOAD_HOURS = 24;

export const UPLOAD_LABELS: Record<UploadKind, string> = {
  firmware: "Firmware image (.bin or Intel HEX .hex)",
  lab_report: "Lab report (PDF)",
  measurements: "Measurements (CSV)",
};
