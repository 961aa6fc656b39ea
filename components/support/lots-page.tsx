"use client";

import { useQuery } from "@tanstack/react-query";
import { apiFetch } from "@/lib/api/client";
import { operationKey } from "@/lib/api/query-key";
import type { LotOptions } from "@/lib/api/operations/support";
import { LotsList } from "./lots-list";
import { LotForm } from "./lot-form";
import { LotImport } from "./lot-import";

export function LotsPage({ canWrite }: { canWrite: boolean }) {
  const options = useQuery({ queryKey: operationKey("getLotOptions"), queryFn: () => apiFetch<LotOptions>("/api/v1/lots/options") });
  return (
    <div className="space-y-5">
      <LotsList options={options.data} />
      {canWrite && <LotForm options={options.data} />}
      {canWrite && <LotImport />}
    </div>
  );
}
