"use client";

import { useMemo, useState } from "react";
import type { HardwareContext, ValidationIssue } from "@/lib/engine";
import { evaluateEditorText, type EditorEvaluation } from "@/lib/registry/editor-evaluation";

/** What the plots show: the current evaluation, or the last one that plotted while the text is broken. */
export interface PlottedEvaluation {
  evaluation: EditorEvaluation | null;
  /** True when the plots are from an earlier text, not the one in the editor. */
  stale: boolean;
  /** The first error of the current text (where to look), when stale. */
  problem: ValidationIssue | undefined;
}

/**
 * Keeps the last evaluation that produced plots, so a draft that stops parsing (or reopens
 * broken) still shows its curves, greyed. On reopening, `savedPlottableText` (the last draft
 * the server saw pass the schema) stands in until the text plots again.
 */
export function useLastPlotted(evaluation: EditorEvaluation | null, hw: HardwareContext | null, savedPlottableText: string | null): PlottedEvaluation {
  const [last, setLast] = useState<EditorEvaluation | null>(null);
  const plots = Boolean(evaluation && evaluation.rows.length > 0);
  // Adjusting state while rendering (not in an effect) keeps the greyed plots one render behind at most.
  if (plots && last !== evaluation) setLast(evaluation);
  const saved = useMemo(() => (!plots && !last && savedPlottableText && hw ? evaluateEditorText(savedPlottableText, hw) : null), [plots, last, savedPlottableText, hw]);
  if (plots) return { evaluation, stale: false, problem: undefined };
  const earlier = last ?? (saved && saved.rows.length > 0 ? saved : null);
  return { evaluation: earlier, stale: earlier !== null, problem: evaluation?.issues.find((i) => i.severity === "error") };
}
