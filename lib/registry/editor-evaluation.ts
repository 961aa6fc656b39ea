import { bankBytes, evaluateCurves, isRevisionCompatible, loadSweep, quantise, validateProfileText, type CoolingProfile, type HardwareContext, type OperatingPoint, type ValidationIssue } from "@/lib/engine";

/** One plotted temperature: authored and as-flashed speeds, and the estimated sound level. */
export interface PlotRow {
  tempC: number;
  pumpRpm: number;
  fanRpm: number;
  pumpRpmFlashed: number;
  fanRpmFlashed: number;
  soundDbA: number;
}

export interface EditorEvaluation {
  issues: ValidationIssue[];
  /** The document when it passed the schema (plots need its shape even with semantic errors). */
  profile: CoolingProfile | undefined;
  rows: PlotRow[];
}

/** Plot range of the editor, °C, and its step. */
export const PLOT_FROM_C = 20;
export const PLOT_TO_C = 70;
export const PLOT_STEP_C = 0.5;

/**
 * What the editor shows for one text: the engine's issues for the chosen hardware,
 * and speeds (authored and after quantise, the board's 0.5 °C / 0.5 % steps) and noise
 * (coolerNoise, via evaluateCurves) from 20 to 70 °C.
 */
export function evaluateEditorText(text: string, hw: HardwareContext): EditorEvaluation {
  const result = validateProfileText(text, hw);
  const profile = result.value;
  if (!profile) return { issues: result.issues, profile: undefined, rows: [] };
  const opts = { fromC: PLOT_FROM_C, toC: PLOT_TO_C, stepC: PLOT_STEP_C };
  try {
    const authored = evaluateCurves(profile, hw, opts);
    const flashed = evaluateCurves(quantise(profile), hw, opts);
    const rows = authored.map((r, i) => ({
      tempC: r.tempC,
      pumpRpm: Math.round(r.pumpRpm),
      fanRpm: Math.round(r.fanRpm),
      pumpRpmFlashed: Math.round(flashed[i]?.pumpRpm ?? r.pumpRpm),
      fanRpmFlashed: Math.round(flashed[i]?.fanRpm ?? r.fanRpm),
      soundDbA: Math.round(r.soundDbA1m * 10) / 10,
    }));
    return { issues: result.issues, profile, rows };
  } catch {
    // A document that passed the schema but that the evaluator refuses (e.g. an extreme value) shows its issues without plots.
    return { issues: result.issues, profile, rows: [] };
  }
}

/** Load sweep for the operating-point chart; empty when the engine refuses the inputs. */
export function safeLoadSweep(profile: CoolingProfile, hw: HardwareContext, ambientC: number, fromW = 50, toW = 350): OperatingPoint[] {
  try {
    return loadSweep(profile, hw, { ambientC, fromW, toW, count: 31 });
  } catch {
    return [];
  }
}

/** Bytes of a bank holding this profile alone, and how it compares with each revision. */
export function memoryUse(profile: CoolingProfile, boardRange: string | null, revisions: readonly { revision: string; memoryBytes: number }[]) {
  const imageBytes = bankBytes([{ pumpPoints: profile.pump.points.length, fanPoints: profile.fans.points.length }]);
  return revisions.map((r) => ({
    revision: r.revision,
    memoryBytes: r.memoryBytes,
    imageBytes,
    fits: imageBytes <= r.memoryBytes,
    compatible: boardRange ? isRevisionCompatible({ revisionVersion: r.revision, range: boardRange, imageBytes, memoryBytes: r.memoryBytes }) : null,
  }));
}
