"use client";

import { DiffEditor } from "@monaco-editor/react";
import { setupMonaco } from "./monaco-setup";

setupMonaco();

/** Two versions side by side in Monaco's diff editor, read only. */
export default function DiffView({ original, modified }: { original: string; modified: string }) {
  return (
    <div data-testid="diff-view">
      <DiffEditor
        height="480px"
        language="json"
        original={original}
        modified={modified}
        options={{ readOnly: true, originalEditable: false, renderSideBySide: true, minimap: { enabled: false }, fontSize: 13, scrollBeyondLastLine: false, automaticLayout: true }}
        loading={<div className="h-[480px] animate-pulse rounded bg-ink-100" />}
      />
    </div>
  );
}
