"use client";

import { useQuery } from "@tanstack/react-query";
import { apiQuery } from "@/lib/api/client";
import { getLotOptions } from "@/lib/api/endpoints";
import type { LotsQuery } from "@/lib/api/operations/support";
import { LotsList } from "./lots-list";
import { LotForm } from "./lot-form";
import { LotImport } from "./lot-import";

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
