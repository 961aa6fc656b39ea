"use client";

import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import type { SaveState } from "./use-autosave";

type Conflict = Extract<SaveState, { kind: "conflict" }>;

/** Someone else saved the draft meanwhile: show both texts and let the user choose; nothing is lost either way. */
export function DraftConflict({ conflict, mine, onTakeTheirs, onKeepMine }: { conflict: Conflict; mine: string; onTakeTheirs: (theirs: string, draftRevision: number) => void; onKeepMine: () => void }) {
  const theirs = conflict.theirs;
  const revision = conflict.theirRevision;
  return (
    <Notice tone="warn" role="alert" title="Your draft was not saved">
      <p>{conflict.message}</p>
      <details className="mt-2">
        <summary className="cursor-pointer underline">Compare your text with theirs</summary>
        <div className="mt-2 grid gap-2 md:grid-cols-2">
          <section aria-label="Your text">
            <h3 className="text-xs font-semibold uppercase text-ink-600">Yours (not saved)</h3>
            <pre className="max-h-64 overflow-auto rounded bg-white p-2 text-xs ring-1 ring-ink-200">{mine}</pre>
          </section>
          <section aria-label="Their text">
            <h3 className="text-xs font-semibold uppercase text-ink-600">Saved on the server</h3>
            <pre className="max-h-64 overflow-auto rounded bg-white p-2 text-xs ring-1 ring-ink-200">{theirs ?? "(could not be loaded; reload the page)"}</pre>
          </section>
        </div>
      </details>
      <div className="mt-2 flex flex-wrap gap-2">
        <Button variant="secondary" disabled={theirs === null || revision === null} onClick={() => theirs !== null && revision !== null && onTakeTheirs(theirs, revision)}>
          Load their draft (discards yours)
        </Button>
        <Button variant="secondary" disabled={revision === null} onClick={onKeepMine}>
          Save mine over theirs
        </Button>
      </div>
    </Notice>
  );
}
