"use client";

import Editor from "@monaco-editor/react";
import type * as Monaco from "monaco-editor";
import { memo, useCallback, useEffect, useMemo, useRef } from "react";
import { changedSpan, type TextEdit } from "@/lib/curve-edit";
import type { ValidationIssue } from "@/lib/engine";
import { PROFILE_MODEL_URI, setupMonaco } from "./monaco-setup";

const monaco = setupMonaco();

export interface EditorHandle {
  /** Moves the cursor to a 1-based line/column and scrolls it to the middle. */
  reveal(line: number, column: number): void;
  /** Replaces the text as if typed (undo works); for imports and benchmarks. */
  setText(text: string): void;
  /** The text as it is in the editor now (newer than React state inside one event). */
  getText(): string;
  /**
   * Applies offset edits (all against the current text) through Monaco, so they join its
   * own undo stack. With `undoStop` they form one undo step of their own; without, they
   * join the open step (one drag = one undo step between pushUndoStop calls).
   */
  applyEdits(edits: readonly TextEdit[], undoStop: boolean): void;
  /** Closes the current undo step (start and end of a drag). */
  pushUndoStop(): void;
}

function toMarker(issue: ValidationIssue): Monaco.editor.IMarkerData {
  const start = issue.range?.start ?? { line: 1, column: 1 };
  const end = issue.range?.end ?? start;
  const sameSpot = end.line === start.line && end.column <= start.column;
  return {
    severity: issue.severity === "error" ? monaco.MarkerSeverity.Error : monaco.MarkerSeverity.Warning,
    message: issue.message,
    code: issue.code,
    source: "Loopkeeper",
    startLineNumber: start.line,
    startColumn: start.column,
    endLineNumber: end.line,
    endColumn: sameSpot ? start.column + 1 : end.column,
  };
}

/** The profile's JSON in Monaco, with the engine's issues as markers. */
function JsonEditor({
  value,
  onChange,
  issues,
  readOnly,
  onReady,
  label,
}: {
  value: string;
  onChange: (text: string) => void;
  issues: ValidationIssue[];
  readOnly: boolean;
  onReady: (handle: EditorHandle) => void;
  label: string;
}) {
  const editorRef = useRef<Monaco.editor.IStandaloneCodeEditor | null>(null);
  // Stable options and change handler: the wrapper re-applies options and re-subscribes its change
  // listener whenever these props are new objects, which would be work on every keystroke.
  const options = useMemo<Monaco.editor.IStandaloneEditorConstructionOptions>(
    () => ({
      readOnly,
      domReadOnly: readOnly,
      minimap: { enabled: false },
      fontSize: 13,
      tabSize: 2,
      scrollBeyondLastLine: false,
      automaticLayout: true,
      ariaLabel: label,
      quickSuggestions: { strings: true, other: true, comments: false },
      // Work Monaco would do after every edit, measured on the keystroke path (bench:editor's
      // profile) and not needed for a profile document: sticky scroll re-reads the outline
      // (document symbols from the JSON worker), bracket pairs are re-coloured, colour swatches,
      // links and unicode highlights are recomputed in a worker (each request first copies the
      // edit to that worker). Folding stays, from indentation on the main thread, not the worker.
      stickyScroll: { enabled: false },
      bracketPairColorization: { enabled: false },
      colorDecorators: false,
      links: false,
      unicodeHighlight: { ambiguousCharacters: false, invisibleCharacters: false, nonBasicASCII: false },
      foldingStrategy: "indentation",
      // No inline (ghost text) completion provider exists for a profile document; off, its model
      // does not re-derive its state from every edit.
      inlineSuggest: { enabled: false },
      // Typed text arrives as the hidden textarea's "input" event, which React treats as discrete
      // input: the keystroke's markers and plots are committed before the browser draws its next
      // frame. Through the EditContext API it arrives as "textupdate", which React schedules as a
      // default update for a later task (a keystroke then took about two frames, bench:editor).
      editContext: false,
    }),
    [readOnly, label],
  );
  const changed = useRef(onChange);
  useEffect(() => {
    changed.current = onChange;
  }, [onChange]);
  const onModelChange = useCallback((v: string | undefined) => changed.current(v ?? ""), []);

  useEffect(() => {
    const model = editorRef.current?.getModel();
    if (model) monaco.editor.setModelMarkers(model, "loopkeeper", issues.map(toMarker));
  }, [issues]);

  return (
    <Editor
      height="100%"
      language="json"
      path={PROFILE_MODEL_URI}
      value={value}
      onChange={onModelChange}
      options={options}
      loading={<div className="h-full animate-pulse rounded bg-ink-100" aria-label="Loading the editor" />}
      onMount={(editor) => {
        editorRef.current = editor;
        const model = editor.getModel();
        if (model) monaco.editor.setModelMarkers(model, "loopkeeper", issues.map(toMarker));
        onReady({
          reveal(line, column) {
            editor.revealLineInCenter(line);
            editor.setPosition({ lineNumber: line, column });
            editor.focus();
          },
          setText(text) {
            const m = editor.getModel();
            if (!m) return;
            // Only the span that differs is replaced (as typing would): Monaco re-tokenises and
            // re-renders those lines alone, and the cursor and scroll position elsewhere stay put.
            const span = changedSpan(m.getValue(), text);
            if (!span) return;
            const start = m.getPositionAt(span.start);
            const end = m.getPositionAt(span.end);
            editor.executeEdits("loopkeeper", [{ range: new monaco.Range(start.lineNumber, start.column, end.lineNumber, end.column), text: span.text, forceMoveMarkers: true }]);
          },
          getText() {
            return editor.getModel()?.getValue() ?? "";
          },
          applyEdits(edits, undoStop) {
            const m = editor.getModel();
            if (!m || edits.length === 0) return;
            const operations = edits.map((e) => {
              const start = m.getPositionAt(e.start);
              const end = m.getPositionAt(e.end);
              return { range: new monaco.Range(start.lineNumber, start.column, end.lineNumber, end.column), text: e.text };
            });
            if (undoStop) editor.pushUndoStop();
            editor.executeEdits("loopkeeper-plot", operations);
            if (undoStop) editor.pushUndoStop();
          },
          pushUndoStop() {
            editor.pushUndoStop();
          },
        });
      }}
    />
  );
}

// Monaco is re-rendered only for new text or markers; background panel updates leave it alone.
export default memo(JsonEditor);
