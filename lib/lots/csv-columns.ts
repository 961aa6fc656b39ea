import type { LotInput } from "./input";

// A plain value, so the import screen can name the columns without loading the lot schema (zod).
/** CSV header names in file order, and the field each fills. */
export const LOT_CSV_COLUMNS = [
  ["lot_code", "lotCode"],
  ["board_revision", "boardRevision"],
  ["build_version", "buildVersion"],
  ["serial_from", "serialFrom"],
  ["serial_to", "serialTo"],
  ["produced_on", "producedOn"],
  ["line", "line"],
] as const satisfies readonly (readonly [string, keyof LotInput])[];
