"use client";

import Link from "next/link";
import { useQuery } from "@tanstack/react-query";
import { apiQuery } from "@/lib/api/client";
import { listBuilds } from "@/lib/api/endpoints";
import { STAGE_LABELS, STAGE_ORDER, type Stage } from "@/lib/release/stages";
import { ErrorNotice } from "@/components/ui/error-notice";

/** Builds in columns by stage, newest first in each; with `stage`, that stage's builds alone. */
export function Pipeline({ stage: only }: { stage?: Stage }) {
  // The page loads the first answer on the server under the same key: no placeholder on first paint.
  const q = useQuery(apiQuery(listBuilds, {}));
  const stages = only ? [only] : STAGE_ORDER;
  if (q.isError) {
    return (
      <ErrorNotice error={q.error} onRetry={() => void q.refetch()} />
    );
  }
  return (
    <>
    {only && (
      <p className="mb-3 text-sm text-ink-700">
        Showing builds at {STAGE_LABELS[only]} only. <Link className="text-copper-700 underline" href="/builds">Show every stage</Link>
      </p>
    )}
    <div className={only ? "grid gap-3 md:grid-cols-2 xl:grid-cols-3" : "grid gap-3 md:grid-cols-3 xl:grid-cols-6"}>
      {stages.map((stage) => {
        const items = q.data?.items.filter((b) => b.stage === stage) ?? [];
        return (
          <section key={stage} aria-labelledby={`col-${stage}`} className="rounded-md bg-ink-50 p-2" data-testid={`pipeline-${stage}`}>
            <h2 id={`col-${stage}`} className="mb-2 flex items-center justify-between px-1 text-sm font-semibold text-ink-800">
              {STAGE_LABELS[stage]} <span className="tabular-nums text-ink-600">{q.data ? items.length : ""}</span>
            </h2>
            <ul className="space-y-2">
              {q.isPending && [0, 1].map((i) => <li key={i} aria-hidden className="h-16 animate-pulse rounded bg-white shadow-panel" />)}
              {items.map((b) => (
                <li key={b.id}>
                  <Link href={`/builds/${b.id}`} className="block rounded bg-white p-2.5 text-sm no-underline shadow-panel hover:ring-2 hover:ring-copper-200">
                    <span className="block font-semibold text-ink-900">{b.version}</span>
                    <span className="block text-xs text-ink-600">{b.boardModel}</span>
                    <span className="block text-xs text-ink-600">Revisions {b.revisionRange}</span>
                    <span className="block text-xs text-ink-600">{b.bankBytes ?? "—"} B · {b.authorName}</span>
                  </Link>
                </li>
              ))}
              {q.data && items.length === 0 && <li className="px-1 text-xs text-ink-500">None</li>}
            </ul>
          </section>
        );
      })}
    </div>
    </>
  );
}
