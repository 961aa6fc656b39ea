"use client";

import { useCallback, useEffect, useRef, useState } from "react";
import { apiCall } from "@/lib/api/client";
import { AppError } from "@/lib/api/errors";
import { getProfile, saveDraft } from "@/lib/api/endpoints";

export type SaveState =
  | { kind: "idle" }
  | { kind: "saving" }
  | { kind: "saved"; at: string }
  | { kind: "error"; message: string }
  /** Someone saved the draft since this editor loaded it; nothing is saved until the user chooses. */
  | { kind: "conflict"; message: string; theirs: string | null; theirRevision: number | null };

/**
 * Debounced PUT of the draft text after typing pauses, based on the draft revision this
 * editor last loaded or saved. A save refused because someone else saved in between stops
 * autosaving and offers the choice: take their draft, or keep mine over theirs.
 */
export function useAutosave(profileId: string, text: string | null, enabled: boolean, initialRevision: number, delayMs = 800) {
  const [state, setState] = useState<SaveState>({ kind: "idle" });
  const lastSaved = useRef<string | null>(null);
  const revision = useRef(initialRevision);
  const blocked = state.kind === "conflict";

  const save = useCallback(
    (body: string) => {
      setState({ kind: "saving" });
      apiCall(saveDraft, { params: { id: profileId }, body: { text: body, baseRevision: revision.current } })
        .then((r) => {
          lastSaved.current = body;
          revision.current = r.draftRevision;
          setState({ kind: "saved", at: r.draftUpdatedAt });
        })
        .catch(async (e: unknown) => {
          if (!(e instanceof AppError)) return setState({ kind: "error", message: "Could not save the draft." });
          if (e.status !== 409) return setState({ kind: "error", message: e.message });
          const latest = await apiCall(getProfile, { params: { id: profileId } }).catch(() => null);
          setState({ kind: "conflict", message: e.message, theirs: latest?.profile.draftText ?? null, theirRevision: latest?.profile.draftRevision ?? null });
        });
    },
    [profileId],
  );

  useEffect(() => {
    if (!enabled || text === null || blocked) return;
    if (lastSaved.current === null) {
      // The first text is what the server already has.
      lastSaved.current = text;
      return;
    }
    if (text === lastSaved.current) return;
    const timer = setTimeout(() => save(text), delayMs);
    return () => clearTimeout(timer);
  }, [text, enabled, delayMs, blocked, save]);

  /** The text on screen is now the server's draft at `draftRevision` (after an import, or taking theirs). */
  const adopt = useCallback((body: string, draftRevision: number) => {
    lastSaved.current = body;
    revision.current = draftRevision;
    setState({ kind: "idle" });
  }, []);

  /** Keep my text over theirs: save it again on top of the revision just seen. */
  const keepMine = useCallback(() => {
    if (state.kind !== "conflict" || state.theirRevision === null || text === null) return;
    revision.current = state.theirRevision;
    save(text);
  }, [state, text, save]);

  return { state, adopt, keepMine };
}
