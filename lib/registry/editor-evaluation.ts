import type { CoolingProfile, CurveKind, HardwareContext, OperatingPoint, ProfileSettings, ValidationIssue } from "@/lib/engine";
// Engine modules directly, not the engine's API (lib/engine): screens load this module with the
// page, and the bundler keeps every module the API re-exports that it cannot prove free of side
// effects (semver's range matching among them) once anything is imported from it.
import { componentLevelDbA } from "@/lib/acoustics/cooler-noise";
import { identicalSourcesDb } from "@/lib/acoustics/levels";
import { bankBytes } from "@/lib/bank/layout";
import { quantise } from "@/lib/bank/quantise";
import { evaluateCurves } from "@/lib/evaluation/curve-table";
import { dutyToRpm } from "@/lib/speeds/rpm";
import { loadSweep } from "@/lib/thermal/operating-point";
import { validateProfileText } from "@/lib/validation/validate";
import { flashedStateAt, slotCodes } from "@/lib/firmware";
import { coolingBranchRpm } from "./cooling-branch";
import { fitAdmittedRevisions, misfitReasons, rangeFitMessage, type RevisionCapacity } from "./range-fit";

/** One plotted temperature: authored and as-flashed speeds, and the estimated sound level. */
export interface PlotRow {
  tempC: number;
  pumpRpm: number;
  fanRpm: number;
  pumpRpmFlashed: number;
  fanRpmFlashed: number;
  soundDbA: number;
  /** Speeds while the liquid cools: the curve read at T + hysteresis (the firmware's play operator held value). */
  pumpRpmFalling: number;
  fanRpmFalling: number;
}

export interface EditorEvaluation {
  issues: ValidationIssue[];
  /** The document when it passed the schema (plots need its shape even with semantic errors). */
  profile: CoolingProfile | undefined;
  rows: PlotRow[];
  /** The document as the board stores it (quantise, the bank encoder's integer codes), for the as-flashed ghosts. */
  flashed: CoolingProfile | undefined;
}

/** Plot range of the editor, °C, and its step. */
export const PLOT_FROM_C = 20;
export const PLOT_TO_C = 70;
export const PLOT_STEP_C = 0.5;

/**
 * The plotted temperature range: 20–70 °C, widened to whole 5 °C steps so every
 * point, the fan stop and the critical temperature are on the plot.
 */
export function plotRangeC(profile: ProfileSettings): { fromC: number; toC: number } {
  const temps = [...profile.pump.points, ...profile.fans.points].map((p) => p.tempC);
  if (profile.fans.stopBelowTempC !== undefined) temps.push(profile.fans.stopBelowTempC);
  temps.push(profile.criticalTempC);
  const lo = Math.min(PLOT_FROM_C, ...temps.map((t) => Math.floor(t / 5) * 5));
  const hi = Math.max(PLOT_TO_C, ...temps.map((t) => Math.ceil(t / 5) * 5));
  return { fromC: Math.max(0, lo), toC: Math.min(100, hi) };
}

/**
 * What the editor shows for one text: the engine's issues for the chosen hardware,
 * and speeds (authored, and as flashed: the stored codes through the firmware's integer
 * control law, lib/firmware, the same path as the firmware vectors) and noise
 * (coolerNoise, via evaluateCurves) over the plot range (plotRangeC).
 */
export function evaluateEditorText(text: string, hw: HardwareContext): EditorEvaluation {
  const result = validateProfileText(text, hw);
  const profile = result.value;
  if (!profile) return { issues: result.issues, profile: undefined, rows: [], flashed: undefined };
  const flashedProfile = quantise(profile);
  const opts = { ...plotRangeC(profile), stepC: PLOT_STEP_C };
  try {
    const authored = evaluateCurves(profile, hw, opts);
    // As flashed: the stored integer codes through the firmware's integer control law, the path the firmware vectors use.
    const codes = slotCodes(profile);
    const rows = authored.map((r) => {
      const flashed = flashedStateAt(codes, hw, r.tempC);
      return {
        tempC: r.tempC,
        pumpRpm: Math.round(r.pumpRpm),
        fanRpm: Math.round(r.fanRpm),
        pumpRpmFlashed: Math.round(flashed.pumpRpm),
        fanRpmFlashed: Math.round(flashed.fanRpm),
        soundDbA: Math.round(r.soundDbA1m * 10) / 10,
        pumpRpmFalling: Math.round(coolingBranchRpm(profile, hw, "pump", r.tempC)),
        fanRpmFalling: Math.round(coolingBranchRpm(profile, hw, "fans", r.tempC)),
      };
    });
    return { issues: result.issues, profile, rows, flashed: flashedProfile };
  } catch {
    // A document that passed the schema but that the evaluator refuses (e.g. an extreme value) shows its issues without plots.
    return { issues: result.issues, profile, rows: [], flashed: flashedProfile };
  }
}

/** One curve point as the points table shows it. */
export interface PointRow {
  tempC: number;
  dutyPct: number;
  /** Speed at this duty (dutyToRpm); a fan point below the fan stop temperature gets 0 % (0 RPM only for a fan that stops at 0 % duty). */
  rpm: number;
  /** This motor group's own level at 1 m: the pump alone, or all fans together (+10·log10 n). */
  soundDbA: number;
}

/** The points of one curve with their speed and the level of that motor group at 1 m. */
export function pointRows(profile: ProfileSettings, hw: HardwareContext, kind: CurveKind): PointRow[] {
  const motor = kind === "pump" ? hw.pump : hw.fan;
  const stop = kind === "fans" ? profile.fans.stopBelowTempC : undefined;
  return profile[kind].points.map((p) => {
    const stopped = stop !== undefined && p.tempC < stop && p.tempC < profile.criticalTempC;
    const rpm = dutyToRpm(stopped ? 0 : p.dutyPct, motor);
    const own = rpm > 0 ? componentLevelDbA(motor, rpm) : -Infinity;
    const soundDbA = kind === "pump" ? own : identicalSourcesDb(own, hw.fanCount);
    return { tempC: p.tempC, dutyPct: p.dutyPct, rpm, soundDbA };
  });
}

/** Load sweep for the operating-point chart; empty when the engine refuses the inputs. */
export function safeLoadSweep(profile: CoolingProfile, hw: HardwareContext, ambientC: number, fromW = 50, toW = 350): OperatingPoint[] {
  try {
    return loadSweep(profile, hw, { ambientC, fromW, toW, count: 31 });
  } catch {
    return [];
  }
}

/**
 * Bytes of a bank holding this profile alone against each board revision, judged against
 * the range typed in the publish form with the same rule publishing applies (points per
 * curve, profile memory, a slot, for every revision the range admits: fitAdmittedRevisions),
 * so the gauge and a publish refusal cannot disagree. `admitted` is what the range admits,
 * in version order (admittedRevisions in range-match.ts, loaded when a range is checked);
 * null while the range is empty or not yet a valid range. `rangeProblem` is the sentence
 * publishing would refuse with; null when the range is fine or not (yet) judged.
 */
export function memoryUse(profile: CoolingProfile, boardRange: string | null, revisions: readonly RevisionCapacity[], admitted: readonly string[] | null) {
  const imageBytes = bankBytes([{ pumpPoints: profile.pump.points.length, fanPoints: profile.fans.points.length }]);
  const needs = { pointsPerCurve: Math.max(profile.pump.points.length, profile.fans.points.length), encodedBytes: imageBytes };
  const range = boardRange?.trim() ?? "";
  const inRange = range === "" || admitted === null ? null : admitted.flatMap((revision) => revisions.filter((r) => r.revision === revision));
  const fit = inRange ? fitAdmittedRevisions(inRange, needs) : null;
  const rows = revisions.map((r) => {
    const reasons = misfitReasons(r, needs);
    return {
      revision: r.revision,
      memoryBytes: r.memoryBytes,
      imageBytes,
      fits: reasons.length === 0,
      reasons,
      /** Whether the typed range admits this revision; null without a valid range. */
      inRange: fit ? fit.inRange.includes(r.revision) : null,
    };
  });
  const rangeProblem = !fit ? null : fit.inRange.length === 0 ? `No board revision satisfies "${range}".` : fit.misfits.length > 0 ? rangeFitMessage(range, fit) : null;
  return { rows, rangeProblem, suggestedRange: fit?.suggestedRange ?? null };
}
