"use client";

import { useCallback, useLayoutEffect, useMemo, useRef, useState } from "react";
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
 *
 * `beforeEdit` is called by whatever changes the text, before it does: the evaluation on screen
 * then is kept if it plotted. Its update joins the text's own, so an edit renders the workspace
 * once (adjusting the kept evaluation while rendering would render it twice per keystroke).
 */
export function useLastPlotted(evaluation: EditorEvaluation | null, hw: HardwareContext | null, savedPlottableText: string | null): { plotted: PlottedEvaluation; beforeEdit: () => void } {
  const [last, setLast] = useState<EditorEvaluation | null>(null);
  const shown = useRef(evaluation);
  useLayoutEffect(() => {
    shown.current = evaluation;
  }, [evaluation]);
  const beforeEdit = useCallback(() => {
    const now = shown.current;
    if (now && now.rows.length > 0) setLast(now);
  }, []);
  const plots = Boolean(evaluation && evaluation.rows.length > 0);
  const saved = useMemo(() => (!plots && !last && savedPlottableText && hw ? evaluateEditorText(savedPlottableText, hw) : null), [plots, last, savedPlottableText, hw]);
  const plotted = useMemo<PlottedEvaluation>(() => {
    if (plots) return { evaluation, stale: false, problem: undefined };
    const earlier = last ?? (saved && saved.rows.length > 0 ? saved : null);
    return { evaluation: earlier, stale: earlier !== null, problem: evaluation?.issues.find((i) => i.severity === "error") };
  }, [plots, evaluation, last, saved]);
  return { plotted, beforeEdit };
}
