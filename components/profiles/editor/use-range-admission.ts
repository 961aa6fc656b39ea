"use client";

import { useEffect, useState } from "react";
import type { RangeAdmission, RevisionCapacity } from "@/lib/registry/range-fit";

type RangeMatch = typeof import("@/lib/registry/range-match");

let loading: Promise<RangeMatch> | null = null;

/** semver's range matching (lib/registry/range-match.ts): not in the page's first load, fetched once when a range is first checked. */
export function loadRangeMatch(): Promise<RangeMatch> {
  loading ??= import("@/lib/registry/range-match").catch((err: unknown) => {
    // A failed fetch (offline for a moment) is tried again on the next check.
    loading = null;
    throw err;
  });
  return loading;
}

/**
 * What `range` admits among `revisions`, in version order; null while it is empty or not a
 * valid range. Taken from what the server judged (`known`) when that covers this range and
 * these revisions, as it does for the range the screen opens with; otherwise from semver's
 * range matching, loaded on demand (`pending` until it has arrived).
 */
export function useRangeAdmission(range: string | null, revisions: readonly RevisionCapacity[], known: readonly RangeAdmission[]): { admitted: string[] | null; pending: boolean } {
  const trimmed = range?.trim() ?? "";
  const fromServer = trimmed === "" ? undefined : known.find((k) => k.range === trimmed && revisions.every((r) => k.checked.includes(r.revision)));
  const needed = trimmed !== "" && !fromServer;
  const [match, setMatch] = useState<RangeMatch | null>(null);
  useEffect(() => {
    if (!needed || match) return;
    let live = true;
    loadRangeMatch().then(
      (m) => {
        if (live) setMatch(m);
      },
      () => undefined,
    );
    return () => {
      live = false;
    };
  }, [needed, match]);
  if (trimmed === "") return { admitted: null, pending: false };
  if (fromServer) return { admitted: fromServer.admitted, pending: false };
  if (match) return { admitted: match.admittedRevisions(trimmed, revisions), pending: false };
  return { admitted: null, pending: true };
}
