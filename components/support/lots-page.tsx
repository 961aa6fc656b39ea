"use client";

import dynamic from "next/dynamic";
import { useQuery } from "@tanstack/react-query";
import { apiQuery } from "@/lib/api/client";
import { getLotOptions } from "@/lib/api/endpoints";
import type { LotsQuery } from "@/lib/api/operations/support";
import { LotsList } from "./lots-list";
import { LotImport } from "./lot-import";

// The form (react-hook-form) is its own chunk, loaded only when the page shows it (people who may write).
const LotForm = dynamic(() => import("./lot-form").then((m) => m.LotForm));

export function LotsPage({ canWrite, query }: { canWrite: boolean; query: LotsQuery }) {
  const options = useQuery(apiQuery(getLotOptions, {}));
  return (
    <div className="space-y-5">
      <LotsList options={options.data} query={query} />
      {canWrite && <LotForm options={options.data} />}
      {canWrite && <LotImport />}
    </div>
  );
}
