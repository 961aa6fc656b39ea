"use client";

import { useEffect, useRef, useState } from "react";
import { apiFetch } from "@/lib/api/client";
import type { AppError } from "@/lib/api/errors";

export type SaveState = { kind: "idle" } | { kind: "saving" } | { kind: "saved"; at: string } | { kind: "error"; message: string };

/** Debounced PUT of the draft text after typing pauses; the last text always wins. */
export function useAutosave(profileId: string, text: string | null, enabled: boolean, delayMs = 800): SaveState {
  const [state, setState] = useState<SaveState>({ kind: "idle" });
  const lastSaved = useRef<string | null>(null);
  useEffect(() => {
    if (!enabled || text === null) return;
    if (lastSaved.current === null) {
      // The first text is what the server already has.
      lastSaved.current = text;
      return;
    }
    if (text === lastSaved.current) return;
    const timer = setTimeout(() => {
      setState({ kind: "saving" });
      apiFetch<{ draftUpdatedAt: string }>(`/api/v1/profiles/${profileId}/draft`, { method: "PUT", json: { text } })
        .then((r) => {
          lastSaved.current = text;
          setState({ kind: "saved", at: r.draftUpdatedAt });
        })
        .catch((e: unknown) => setState({ kind: "error", message: (e as AppError).message }));
    }, delayMs);
    return () => clearTimeout(timer);
  }, [profileId, text, enabled, delayMs]);
  return state;
}
