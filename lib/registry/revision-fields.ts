/**
 * A board revision's fields, written once: their names in form order, each number's unit and
 * limits, and what a person is told when a value is outside them. The API's schema
 * (lib/api/operations/registry-schemas.ts), the registry forms, the stored row's view
 * (db/boards.ts) and the rule on shipped layouts (./shipped.ts) are built from this list.
 * Plain data without imports, so browser code loads it without zod.
 */

/** A whole number of a board revision: its label and unit, and the limits the API holds it to. */
export interface RevisionNumberField {
  /** What forms call it; the unit follows in brackets where the number has one. */
  label: string;
  unit?: string;
  hint?: string;
  /** Typed as text, in decimal or as 0x… hex (an address), rather than in a number box. */
  hex?: boolean;
  /** How "Enter … as a number." names it. */
  noun: string;
  /** Said when the value is not a whole number. */
  wholeMessage: string;
  min: number;
  minMessage: string;
  max: number;
  maxMessage: string;
}

/** The numbers of a board revision, in form order. */
export const REVISION_NUMBER_KEYS = ["memoryBytes", "baseAddress", "slotCount", "maxPointsPerCurve", "pwmFrequencyHz", "tachPulsesPerRev"] as const;
export type RevisionNumberKey = (typeof REVISION_NUMBER_KEYS)[number];

export const REVISION_NUMBER_FIELDS: Readonly<Record<RevisionNumberKey, RevisionNumberField>> = {
  memoryBytes: {
    label: "Profile memory",
    unit: "bytes",
    noun: "the memory size",
    wholeMessage: "Whole bytes.",
    min: 16,
    minMessage: "At least 16 bytes.",
    max: 65535,
    maxMessage: "At most 65,535 bytes (the bank format's limit).",
  },
  baseAddress: {
    label: "Base address",
    hint: "Decimal, or hex as 0x0801F800.",
    hex: true,
    noun: "the base address",
    wholeMessage: "A whole address.",
    min: 0,
    minMessage: "At least 0.",
    max: 0xffffffff,
    maxMessage: "At most 0xFFFFFFFF.",
  },
  slotCount: { label: "Profile slots", noun: "the slot count", wholeMessage: "A whole number.", min: 1, minMessage: "At least 1 slot.", max: 16, maxMessage: "At most 16 slots." },
  maxPointsPerCurve: { label: "Max points per curve", noun: "the point limit", wholeMessage: "A whole number.", min: 2, minMessage: "At least 2 points.", max: 32, maxMessage: "At most 32 points." },
  pwmFrequencyHz: { label: "PWM frequency", unit: "Hz", noun: "the PWM frequency", wholeMessage: "Whole hertz.", min: 100, minMessage: "At least 100 Hz.", max: 100000, maxMessage: "At most 100 kHz." },
  tachPulsesPerRev: { label: "Tach pulses per revolution", noun: "the tach pulses", wholeMessage: "A whole number.", min: 1, minMessage: "At least 1.", max: 12, maxMessage: "At most 12." },
};

/** The revision's own version and its free-text notes. */
export const REVISION_TEXT_FIELDS = {
  revision: { label: "Revision", hint: "Semantic version, e.g. 2.1.0." },
  notes: { label: "Notes", maxChars: 500 },
} as const;

/** Fields of a board revision that describe the flashed memory layout, in form order. */
export const REVISION_LAYOUT_FIELDS = ["revision", ...REVISION_NUMBER_KEYS] as const;
export type RevisionLayoutField = (typeof REVISION_LAYOUT_FIELDS)[number];

/** Every field a person gives a board revision, in form order: the layout, then the notes. */
export const REVISION_FIELDS = [...REVISION_LAYOUT_FIELDS, "notes"] as const;
export type RevisionField = (typeof REVISION_FIELDS)[number];

/** A number's label with its unit, as forms show it: "Profile memory (bytes)". */
export function revisionNumberLabel(f: RevisionNumberField): string {
  return f.unit ? `${f.label} (${f.unit})` : f.label;
}

/** The revision's own fields of `row` (a stored row, a view or a form's values), without ids or timestamps. */
export function revisionFieldsOf<T extends Record<RevisionField, unknown>>(row: T): Pick<T, RevisionField> {
  return Object.fromEntries(REVISION_FIELDS.map((k) => [k, row[k]])) as Pick<T, RevisionField>;
}
