"use client";

import { useCallback, useRef, useState } from "react";
import type { UploadProgress } from "@/lib/api/client";

/** Where an upload stands, for the progress bar: sending bytes, then the server working, then an end. */
export type UploadState =
  | { phase: "idle" }
  | { phase: "sending"; percent: number; fileName: string }
  | { phase: "processing"; percent: number | null; label: string; fileName: string }
  | { phase: "done"; fileName: string }
  | { phase: "cancelled"; fileName: string };

/** What a task gets: the signal Cancel aborts, and the callbacks that move the bar. */
export interface UploadControls {
  signal: AbortSignal;
  onProgress: (p: UploadProgress) => void;
  /** The server is working on what it received; `percent` null when it cannot say how far. */
  processing: (label: string, percent: number | null) => void;
}

const isAbort = (err: unknown) => err instanceof DOMException && err.name === "AbortError";

/**
 * One upload at a time with progress and Cancel. `run` answers the task's result, or null when
 * it was cancelled (nothing to report then); other failures are thrown on to the caller.
 */
export function useUpload() {
  const [state, setState] = useState<UploadState>({ phase: "idle" });
  const controller = useRef<AbortController | null>(null);

  const run = useCallback(async <T,>(fileName: string, task: (c: UploadControls) => Promise<T>): Promise<T | null> => {
    controller.current?.abort();
    const ctrl = new AbortController();
    controller.current = ctrl;
    setState({ phase: "sending", percent: 0, fileName });
    try {
      const result = await task({
        signal: ctrl.signal,
        onProgress: ({ sentBytes, totalBytes }) => {
          if (ctrl.signal.aborted) return;
          setState({ phase: "sending", percent: totalBytes > 0 ? Math.min(100, Math.round((100 * sentBytes) / totalBytes)) : 0, fileName });
        },
        processing: (label, percent) => {
          if (!ctrl.signal.aborted) setState({ phase: "processing", percent, label, fileName });
        },
      });
      if (ctrl.signal.aborted) {
        setState({ phase: "cancelled", fileName });
        return null;
      }
      setState({ phase: "done", fileName });
      return result;
    } catch (err) {
      if (isAbort(err) || ctrl.signal.aborted) {
        setState({ phase: "cancelled", fileName });
        return null;
      }
      setState({ phase: "idle" });
      throw err;
    } finally {
      if (controller.current === ctrl) controller.current = null;
    }
  }, []);

  const cancel = useCallback(() => controller.current?.abort(), []);
  const reset = useCallback(() => setState({ phase: "idle" }), []);
  const busy = state.phase === "sending" || state.phase === "processing";
  return { state, run, cancel, reset, busy };
}
