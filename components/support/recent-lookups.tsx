"use client";

import { useQuery } from "@tanstack/react-query";
import { useEffect } from "react";
import { apiQuery } from "@/lib/api/client";
import { listRecentLookups } from "@/lib/api/endpoints";


export function RecentLookups({ onPick, refreshKey }: { onPick: (serial: string) => void; refreshKey: string }) {
  const q = useQuery(apiQuery(listRecentLookups, {}));
  const { refetch } = q;
  useEffect(() => {
    void refetch();
  }, [refreshKey, refetch]);
  if (!q.data?.items.length) return null;
  return (
    <nav aria-label="Recent lookups" className="mt-3 flex flex-wrap items-center gap-2 text-sm">
      <span className="text-ink-600">Recent:</span>
      {q.data.items.map((r) => (
        <button
          key={r.serial}
          type="button"
          onClick={() => onPick(r.serial)}
          className={`rounded px-2 py-0.5 font-mono text-xs ring-1 ring-inset ${r.found ? "bg-ink-50 text-ink-800 ring-ink-300" : "bg-signal-warnBg text-signal-warn ring-signal-warn/30"}`}
          title={r.found ? "Found" : "Not found"}
        >
          {r.serial}
        </button>
      ))}
    </nav>
  );
}
