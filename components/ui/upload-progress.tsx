"use client";

import { Button } from "./button";
import type { UploadState } from "./use-upload";

/**
 * The progress of one upload: a bar with its percentage while bytes go out and while the
 * server works (when it can say how far), Cancel while it runs, and what a cancel left behind.
 */
export function UploadProgressBar({ state, onCancel, cancelledNote = "Cancelled; nothing was saved." }: { state: UploadState; onCancel: () => void; cancelledNote?: string }) {
  if (state.phase === "idle" || state.phase === "done") return null;
  if (state.phase === "cancelled") {
    return (
      <p role="status" className="text-sm text-ink-700" data-testid="upload-cancelled">
        {state.fileName}: {cancelledNote}
      </p>
    );
  }
  const percent = state.percent;
  const label = state.phase === "sending" ? `Sending ${state.fileName}` : state.label;
  return (
    <div className="flex flex-wrap items-center gap-3" data-testid="upload-progress">
      <div className="min-w-48 flex-1">
        <div className="mb-1 flex justify-between text-xs text-ink-700">
          <span>{label}</span>
          <span className="tabular-nums" data-testid="upload-percent">{percent === null ? "working…" : `${percent} %`}</span>
        </div>
        <div
          role="progressbar"
          aria-label={label}
          aria-valuemin={0}
          aria-valuemax={100}
          aria-valuenow={percent ?? undefined}
          aria-valuetext={percent === null ? "working" : `${percent} %`}
          className="h-2 overflow-hidden rounded bg-ink-100"
        >
          <div className={`h-full bg-copper-500 transition-[width] ${percent === null ? "w-1/3 animate-pulse" : ""}`} style={percent === null ? undefined : { width: `${percent}%` }} />
        </div>
      </div>
      <Button variant="secondary" onClick={onCancel}>Cancel upload</Button>
    </div>
  );
}
