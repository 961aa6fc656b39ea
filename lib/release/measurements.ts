import { coolerNoise, type HardwareContext } from "../engine";

/** The header a lab measurement CSV must start with (liquid °C, pump RPM, fan RPM, sound dB(A) at 1 m). */
export const MEASUREMENT_COLUMNS = ["liquid_temp_c", "pump_rpm", "fan_rpm", "sound_dba"] as const;
export const MEASUREMENT_HEADER = MEASUREMENT_COLUMNS.join(",");
export const MAX_MEASUREMENT_ROWS = 2000;

export interface MeasurementRow {
  liquidTempC: number;
  pumpRpm: number;
  fanRpm: number;
  soundDbA: number;
}

export type ParseMeasurementsResult = { ok: true; rows: MeasurementRow[] } | { ok: false; errors: string[] };

const LIMITS: Record<(typeof MEASUREMENT_COLUMNS)[number], [number, number]> = {
  liquid_temp_c: [-20, 120],
  pump_rpm: [0, 20000],
  fan_rpm: [0, 20000],
  sound_dba: [0, 140],
};

/** Whether `text` starts with the measurement header (the content check of an upload). */
export function hasMeasurementHeader(text: string): boolean {
  const first = text.replace(/^\uFEFF/, "").split(/\r?\n/, 1)[0] ?? "";
  return first.split(",").map((c) => c.trim().toLowerCase()).join(",") === MEASUREMENT_HEADER;
}

/** Parses the lab CSV: the header, then one numeric row per operating point; errors name the line. */
export function parseMeasurementsCsv(text: string): ParseMeasurementsResult {
  if (!hasMeasurementHeader(text)) return { ok: false, errors: [`The first line must be the header "${MEASUREMENT_HEADER}".`] };
  const lines = text.replace(/^\uFEFF/, "").split(/\r?\n/);
  const rows: MeasurementRow[] = [];
  const errors: string[] = [];
  for (let i = 1; i < lines.length; i++) {
    const line = lines[i]!.trim();
    if (!line) continue;
    const cells = line.split(",").map((c) => c.trim());
    if (cells.length !== MEASUREMENT_COLUMNS.length) {
      errors.push(`Line ${i + 1}: expected ${MEASUREMENT_COLUMNS.length} values, found ${cells.length}.`);
      continue;
    }
    const values = cells.map(Number);
    const bad = MEASUREMENT_COLUMNS.findIndex((col, j) => {
      const v = values[j]!;
      const [lo, hi] = LIMITS[col];
      return cells[j] === "" || !Number.isFinite(v) || v < lo || v > hi;
    });
    if (bad >= 0) {
      const col = MEASUREMENT_COLUMNS[bad]!;
      errors.push(`Line ${i + 1}: ${col} must be a number from ${LIMITS[col][0]} to ${LIMITS[col][1]}.`);
      continue;
    }
    rows.push({ liquidTempC: values[0]!, pumpRpm: values[1]!, fanRpm: values[2]!, soundDbA: values[3]! });
  }
  if (rows.length === 0 && errors.length === 0) errors.push("The file has a header but no measurement rows.");
  if (rows.length > MAX_MEASUREMENT_ROWS) errors.push(`At most ${MAX_MEASUREMENT_ROWS} rows are accepted.`);
  return errors.length ? { ok: false, errors: errors.slice(0, 20) } : { ok: true, rows };
}

export interface MeasurementComparison extends MeasurementRow {
  /** The engine's estimate at the same pump and fan speeds, dB(A) at 1 m. */
  estimatedDbA: number;
  /** Measured minus estimated, dB. */
  deltaDb: number;
  withinTolerance: boolean;
}

/**
 * Measured sound against the estimate at the measured speeds: coolerNoise (fan-law
 * scaling L = Lref + k·log10(N/Nref), n fans +10·log10(n), incoherent sum with the pump).
 */
export function compareMeasurements(rows: readonly MeasurementRow[], hw: HardwareContext, toleranceDb: number): MeasurementComparison[] {
  return rows.map((r) => {
    const estimatedDbA = coolerNoise(hw, r.fanRpm, r.pumpRpm).totalDbA1m;
    const deltaDb = r.soundDbA - estimatedDbA;
    return { ...r, estimatedDbA, deltaDb, withinTolerance: Number.isFinite(deltaDb) && Math.abs(deltaDb) <= toleranceDb };
  });
}

/** Reasons the sound comparison fails the gate into pilot; empty when every row is within tolerance. */
export function soundGateIssues(comparison: readonly MeasurementComparison[], toleranceDb: number): string[] {
  const off = comparison.filter((c) => !c.withinTolerance);
  if (off.length === 0) return [];
  const worst = off.reduce((a, b) => (Math.abs(b.deltaDb) > Math.abs(a.deltaDb) ? b : a));
  return [
    `${off.length} of ${comparison.length} measured sound levels differ from the estimate by more than ${toleranceDb} dB ` +
      `(worst: ${worst.soundDbA.toFixed(1)} dB(A) measured against ${worst.estimatedDbA.toFixed(1)} estimated at pump ${worst.pumpRpm} RPM, fans ${worst.fanRpm} RPM). ` +
      `Check the rig, or record a waiver with a reason.`,
  ];
}
