"use client";

import { useCallback, useLayoutEffect, useMemo, useRef, useState, type RefObject } from "react";
import {
  clampToBound,
  CurveEditError,
  fanStopBound,
  hysteresisBound,
  insertPointEdit,
  newPointAt,
  pointDutyBound,
  pointTempBound,
  removalRefusal,
  removePointEdit,
  scanDocument,
  setNumberEdit,
  type TextEdit,
} from "@/lib/curve-edit";
import type { CoolingProfile, CurveKind, HardwareContext } from "@/lib/engine";
import type { EditorHandle } from "./json-editor";

/** What a handle on the plot (or a row of the points table) edits. */
export type EditTarget = { type: "point"; kind: CurveKind; index: number } | { type: "fanStop" } | { type: "hysteresis"; kind: CurveKind };

/** A stable key of a target, e.g. "fans/3", "fanStop", "hysteresis/pump". */
export const targetKey = (t: EditTarget): string => (t.type === "point" ? `${t.kind}/${t.index}` : t.type === "fanStop" ? "fanStop" : `hysteresis/${t.kind}`);

/** Why the last edit of a handle stopped short or was refused, shown beside it. */
export interface EditNotice {
  key: string;
  text: string;
}

/** The editing actions the plot and the points table share. */
export interface CurveEditing {
  /** Moves a point towards `want`, clamped to the rules; `undoStop` makes it one undo step on its own (keys, table). */
  movePoint(kind: CurveKind, index: number, want: { tempC?: number; dutyPct?: number }, undoStop: boolean): void;
  /** Sets the fan stop temperature or a curve's hysteresis, clamped. */
  setValue(target: Exclude<EditTarget, { type: "point" }>, value: number, undoStop: boolean): void;
  addPoint(kind: CurveKind, tempC?: number): void;
  removePoint(kind: CurveKind, index: number): void;
  /** Starts and ends a drag: everything between is one undo step. */
  beginGesture(): void;
  endGesture(): void;
  notice: EditNotice | null;
  clearNotice(): void;
}

/**
 * Direct editing of the curves, written into the JSON text through Monaco: every
 * change replaces exactly the numbers it is about (lib/curve-edit), clamped to the
 * rules with the reason kept for the handle to show.
 */
export function useCurveEditing(editor: RefObject<EditorHandle | null>, profileNow: CoolingProfile | undefined, hwNow: HardwareContext | null, enabled: boolean): CurveEditing | null {
  const [notice, setNotice] = useState<EditNotice | null>(null);
  // The actions read the committed document through a ref, so they (and the object handed to the
  // plot and the points table) stay the same from one keystroke to the next.
  const committed = useRef({ profile: profileNow, hw: hwNow });
  useLayoutEffect(() => {
    committed.current = { profile: profileNow, hw: hwNow };
  }, [profileNow, hwNow]);

  const apply = useCallback(
    (key: string, build: (text: string) => TextEdit[], undoStop: boolean, reason?: string) => {
      const handle = editor.current;
      if (!handle) return;
      const text = handle.getText();
      try {
        // Only edits that change something: a drag that stays on one step writes nothing.
        const edits = build(text).filter((e) => text.slice(e.start, e.end) !== e.text);
        handle.applyEdits(edits, undoStop);
        setNotice(reason ? { key, text: reason } : (n) => (n?.key === key ? null : n));
      } catch (err) {
        if (err instanceof CurveEditError) setNotice({ key, text: err.message });
        else throw err;
      }
    },
    [editor],
  );

  const movePoint = useCallback<CurveEditing["movePoint"]>(
    (kind, index, want, undoStop) => {
      const { profile, hw } = committed.current;
      const key = `${kind}/${index}`;
      const point = profile?.[kind].points[index];
      if (!profile || !hw || !point) return;
      const points = profile[kind].points;
      const temp = want.tempC === undefined ? { value: point.tempC } : clampToBound(want.tempC, pointTempBound(points, kind, index), point.tempC);
      const duty = want.dutyPct === undefined ? { value: point.dutyPct } : clampToBound(want.dutyPct, pointDutyBound(points, kind, index, hw), point.dutyPct);
      apply(
        key,
        (text) => {
          const scan = scanDocument(text);
          const edits: TextEdit[] = [];
          if (want.tempC !== undefined) edits.push(setNumberEdit(text, `/${kind}/points/${index}/tempC`, temp.value, scan));
          if (want.dutyPct !== undefined) edits.push(setNumberEdit(text, `/${kind}/points/${index}/dutyPct`, duty.value, scan));
          return edits;
        },
        undoStop,
        duty.reason ?? temp.reason,
      );
    },
    [apply],
  );

  const setValue = useCallback<CurveEditing["setValue"]>(
    (target, value, undoStop) => {
      const { profile } = committed.current;
      if (!profile) return;
      const key = targetKey(target);
      if (target.type === "fanStop") {
        const current = profile.fans.stopBelowTempC;
        if (current === undefined) return;
        const clamped = clampToBound(value, fanStopBound(profile), current);
        apply(key, (text) => [setNumberEdit(text, "/fans/stopBelowTempC", clamped.value)], undoStop, clamped.reason);
      } else {
        const current = profile[target.kind].hysteresisC;
        const clamped = clampToBound(value, hysteresisBound(), current);
        apply(key, (text) => [setNumberEdit(text, `/${target.kind}/hysteresisC`, clamped.value)], undoStop, clamped.reason);
      }
    },
    [apply],
  );

  const addPoint = useCallback<CurveEditing["addPoint"]>(
    (kind, tempC) => {
      const { profile, hw } = committed.current;
      if (!profile || !hw) return;
      const key = `${kind}/add`;
      const insertion = newPointAt(profile[kind].points, kind, hw.boardRevision.maxPointsPerCurve, tempC);
      if (!insertion.ok) {
        setNotice({ key, text: insertion.reason });
        return;
      }
      apply(key, (text) => [insertPointEdit(text, kind, insertion.index, insertion.point)], true);
    },
    [apply],
  );

  const removePoint = useCallback<CurveEditing["removePoint"]>(
    (kind, index) => {
      const { profile } = committed.current;
      if (!profile) return;
      const key = `${kind}/${index}`;
      const refusal = removalRefusal(profile[kind].points, kind);
      if (refusal) {
        setNotice({ key, text: refusal });
        return;
      }
      apply(key, (text) => [removePointEdit(text, kind, index)], true);
    },
    [apply],
  );

  const beginGesture = useCallback(() => editor.current?.pushUndoStop(), [editor]);
  const endGesture = useCallback(() => editor.current?.pushUndoStop(), [editor]);
  const clearNotice = useCallback(() => setNotice(null), []);

  const ready = enabled && Boolean(profileNow) && Boolean(hwNow);
  return useMemo(
    () => (ready ? { movePoint, setValue, addPoint, removePoint, beginGesture, endGesture, notice, clearNotice } : null),
    [ready, movePoint, setValue, addPoint, removePoint, beginGesture, endGesture, notice, clearNotice],
  );
}
