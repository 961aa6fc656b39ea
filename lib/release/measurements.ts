import { coolerNoise, type HardwareContext } from "../engine";
import { splitCsv, withoutBom } from "../csv/read";
import { correctForBackground, ISO_3744_MIN_DIFFERENCE_DB, type BackgroundCorrection } from "../acoustics/background-correction";

/** The header a lab measurement CSV must start with (liquid °C, pump RPM, fan RPM, sound dB(A) at 1 m). */
export const MEASUREMENT_COLUMNS = ["liquid_temp_c", "pump_rpm", "fan_rpm", "sound_dba"] as const;
export const MEASUREMENT_HEADER = MEASUREMENT_COLUMNS.join(",");
/** Optional fifth column: the room's background level, dB(A), per point or once on the first row. */
export const BACKGROUND_COLUMN = "background_dba";
export const MEASUREMENT_HEADER_WITH_BACKGROUND = `${MEASUREMENT_HEADER},${BACKGROUND_COLUMN}`;
export const MAX_MEASUREMENT_ROWS = 2000;

export interface MeasurementRow {
  liquidTempC: number;
  pumpRpm: number;
  fanRpm: number;
  soundDbA: number;
  /** The room without the cooler running, dB(A); null when the lab gave none. */
  backgroundDbA: number | null;
}

export type ParseMeasurementsResult = { ok: true; rows: MeasurementRow[] } | { ok: false; errors: string[] };

const LIMITS: Record<(typeof MEASUREMENT_COLUMNS)[number] | typeof BACKGROUND_COLUMN, [number, number]> = {
  liquid_temp_c: [-20, 120],
  pump_rpm: [0, 20000],
  fan_rpm: [0, 20000],
  sound_dba: [0, 140],
  background_dba: [0, 140],
};

/** The header's column names, read from the first line alone (the content check runs on whole uploads). */
function headerColumns(text: string): string[] {
  const first = withoutBom(text).split(/\r?\n/, 1)[0] ?? "";
  return (splitCsv(first)[0]?.fields ?? []).map((c) => c.trim().toLowerCase());
}

/** Whether `text` starts with the measurement header, with or without the background column (the content check of an upload). */
export function hasMeasurementHeader(text: string): boolean {
  const header = headerColumns(text).join(",");
  return header === MEASUREMENT_HEADER || header === MEASUREMENT_HEADER_WITH_BACKGROUND;
}

/**
 * Parses the lab CSV: the header, then one numeric row per operating point; errors name
 * the line. With a background column, every row carries its own background level, or only
 * the first row does and that one value stands for the whole session.
 */
export function parseMeasurementsCsv(text: string): ParseMeasurementsResult {
  if (!hasMeasurementHeader(text)) return { ok: false, errors: [`The first line must be the header "${MEASUREMENT_HEADER}" (optionally followed by ",${BACKGROUND_COLUMN}").`] };
  const columns = headerColumns(text) as (keyof typeof LIMITS)[];
  const records = splitCsv(withoutBom(text)).slice(1);
  const rows: MeasurementRow[] = [];
  const errors: string[] = [];
  const backgroundGiven: boolean[] = [];
  for (const { line, fields } of records) {
    const cells = fields.map((c) => c.trim());
    // A line of nothing but spaces is a blank line.
    if (cells.length === 1 && cells[0] === "") continue;
    // A trailing empty background cell may be left off.
    if (columns.length === 5 && cells.length === 4) cells.push("");
    if (cells.length !== columns.length) {
      errors.push(`Line ${line}: expected ${columns.length} values, found ${cells.length}.`);
      continue;
    }
    const values = cells.map(Number);
    const bad = columns.findIndex((col, j) => {
      if (col === BACKGROUND_COLUMN && cells[j] === "") return false;
      const v = values[j]!;
      const [lo, hi] = LIMITS[col];
      return cells[j] === "" || !Number.isFinite(v) || v < lo || v > hi;
    });
    if (bad >= 0) {
      const col = columns[bad]!;
      errors.push(`Line ${line}: ${col} must be a number from ${LIMITS[col][0]} to ${LIMITS[col][1]}.`);
      continue;
    }
    const hasBackground = columns.length === 5 && cells[4] !== "";
    backgroundGiven.push(hasBackground);
    rows.push({ liquidTempC: values[0]!, pumpRpm: values[1]!, fanRpm: values[2]!, soundDbA: values[3]!, backgroundDbA: hasBackground ? values[4]! : null });
  }
  if (rows.length === 0 && errors.length === 0) errors.push("The file has a header but no measurement rows.");
  if (rows.length > MAX_MEASUREMENT_ROWS) errors.push(`At most ${MAX_MEASUREMENT_ROWS} rows are accepted.`);
  const given = backgroundGiven.filter(Boolean).length;
  if (given > 0 && given < rows.length) {
    if (given === 1 && backgroundGiven[0]) {
      const once = rows[0]!.backgroundDbA;
      for (const r of rows) r.backgroundDbA = once;
    } else {
      errors.push(`${BACKGROUND_COLUMN} is given on ${given} of ${rows.length} rows; give it on every row, or only on the first row for the whole session.`);
    }
  }
  return errors.length ? { ok: false, errors: errors.slice(0, 20) } : { ok: true, rows };
}

export type ComparisonStatus = "within" | "above_tolerance" | "too_close_to_background";

export interface MeasurementComparison extends MeasurementRow {
  /** The engine's estimate at the same pump and fan speeds, dB(A) at 1 m. */
  estimatedDbA: number;
  /** Measured minus background, dB; null without a background level. */
  backgroundDifferenceDb: number | null;
  /** K1 subtracted from the measured level, dB; null when not comparable. */
  correctionDb: number | null;
  /** The cooler's own level after background correction; null when too close to background. */
  correctedDbA: number | null;
  /** Corrected minus estimated, dB; null when not comparable. */
  deltaDb: number | null;
  status: ComparisonStatus;
  /** True unless the corrected level exceeds the estimate by more than the tolerance. */
  withinTolerance: boolean;
}

function statusOf(correction: BackgroundCorrection, deltaDb: number | null, toleranceDb: number): ComparisonStatus {
  if (correction.state === "too_close") return "too_close_to_background";
  return deltaDb !== null && Number.isFinite(deltaDb) && deltaDb <= toleranceDb ? "within" : "above_tolerance";
}

/**
 * Measured sound against the estimate at the measured speeds: the measured level corrected
 * for the room's background (ISO 3744:2010 §8.2.3, see lib/acoustics/background-correction),
 * then compared with coolerNoise (each unit's measured sound table where the registry has
 * one, otherwise fan-law scaling L = Lref + k·log10(N/Nref); n fans +10·log10(n),
 * incoherent sum with the pump). A point fails only when the cooler is
 * louder than estimated by more than the tolerance; quieter is not a fault of the curve.
 */
export function compareMeasurements(rows: readonly MeasurementRow[], hw: HardwareContext, toleranceDb: number, minDifferenceDb = ISO_3744_MIN_DIFFERENCE_DB): MeasurementComparison[] {
  return rows.map((r) => {
    const estimatedDbA = coolerNoise(hw, r.fanRpm, r.pumpRpm).totalDbA1m;
    const correction = correctForBackground(r.soundDbA, r.backgroundDbA, minDifferenceDb);
    const deltaDb = correction.correctedDbA === null ? null : correction.correctedDbA - estimatedDbA;
    const status = statusOf(correction, deltaDb, toleranceDb);
    return {
      ...r,
      estimatedDbA,
      backgroundDifferenceDb: correction.differenceDb,
      correctionDb: correction.correctionDb,
      correctedDbA: correction.correctedDbA,
      deltaDb,
      status,
      withinTolerance: status !== "above_tolerance",
    };
  });
}

/**
 * Reasons the sound comparison fails the gate into pilot; empty when it passes. Points too
 * close to the background are set aside (they say nothing about the cooler); if every point
 * is, nothing was compared and the gate asks for a quieter room or a waiver.
 */
export function soundGateIssues(comparison: readonly MeasurementComparison[], toleranceDb: number): string[] {
  const comparable = comparison.filter((c) => c.status !== "too_close_to_background");
  if (comparable.length === 0) {
    return [
      `All ${comparison.length} measured points are within ${ISO_3744_MIN_DIFFERENCE_DB} dB of the room's background, so none can be compared with the estimate (ISO 3744:2010 §8.2.3 background criterion). Measure in a quieter room, or record a waiver with a reason.`,
    ];
  }
  const off = comparable.filter((c) => c.status === "above_tolerance");
  if (off.length === 0) return [];
  const worst = off.reduce((a, b) => ((b.deltaDb ?? 0) > (a.deltaDb ?? 0) ? b : a));
  return [
    `${off.length} of ${comparable.length} comparable measured sound levels exceed the estimate by more than ${toleranceDb} dB ` +
      `(worst: ${(worst.correctedDbA ?? worst.soundDbA).toFixed(1)} dB(A) after background correction against ${worst.estimatedDbA.toFixed(1)} estimated at pump ${worst.pumpRpm} RPM, fans ${worst.fanRpm} RPM). ` +
      `Check the rig, or record a waiver with a reason.`,
  ];
}

/** One line for a passing comparison: how many points were compared and how many set aside. */
export function soundGateSummary(comparison: readonly MeasurementComparison[], toleranceDb: number): string {
  const close = comparison.filter((c) => c.status === "too_close_to_background").length;
  const compared = comparison.length - close;
  return `${compared} of ${comparison.length} points compared, none louder than the estimate by more than ${toleranceDb} dB` + (close ? `; ${close} too close to background to compare.` : ".");
}
