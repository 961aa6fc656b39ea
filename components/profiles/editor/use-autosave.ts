"use client";

import { useEffect, useRef, useState } from "react";
import { apiCall } from "@/lib/api/client";
import { AppError } from "@/lib/api/errors";
import { saveDraft } from "@/lib/api/operations/profiles";

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
      apiCall(saveDraft, { params: { id: profileId }, body: { text } })
        .then((r) => {
          lastSaved.current = text;
          setState({ kind: "saved", at: r.draftUpdatedAt });
        })
        .catch((e: unknown) => setState({ kind: "error", message: e instanceof AppError ? e.message : "Could not save the draft." }));
    }, delayMs);
    return () => clearTimeout(timer);
  }, [profileId, text, enabled, delayMs]);
  return state;
}
