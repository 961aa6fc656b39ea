"use client";

import dynamic from "next/dynamic";
import { useQuery } from "@tanstack/react-query";
import type { ColumnDef } from "@tanstack/react-table";
import Link from "next/link";
import { apiQuery } from "@/lib/api/client";
import { listCoolerModels } from "@/lib/api/endpoints";
import type { CoolerModelView } from "@/lib/api/operations/registry-schemas";
import type { CoolerModelsQuery } from "@/lib/api/operations/registry";
import { COOLER_FILTERS } from "@/lib/api/screen-queries";
import { useMemo, useState } from "react";
import { Button } from "@/components/ui/button";
import { Input } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";
import { DataTable } from "./data-table";
import { FilterBar } from "./filter-bar";
import { useListParams, serverTableProps } from "./use-list-params";

// The form (react-hook-form) is its own chunk, loaded only when the page shows it (people who may write).
const CoolerModelForm = dynamic(() => import("./cooler-model-form").then((m) => m.CoolerModelForm));

const columns: ColumnDef<CoolerModelView>[] = [
  { id: "name", accessorKey: "name", header: "Name", cell: (c) => <span className="font-medium">{c.row.original.name}</span> },
  { id: "radiatorMm", accessorKey: "radiatorMm", header: "Radiator (mm)", cell: (c) => <span className="tabular-nums">{c.row.original.radiatorMm}</span> },
  { id: "fanCount", accessorKey: "fanCount", header: "Fans", cell: (c) => <span>{c.row.original.fanCount} × {c.row.original.fanName}</span> },
  { id: "pump", header: "Pump", enableSorting: false, cell: (c) => c.row.original.pumpName },
  { id: "board", header: "Board", enableSorting: false, cell: (c) => c.row.original.boardModelName },
  {
    id: "resistance",
    header: "Radiator K/W (min → max fan)",
    enableSorting: false,
    cell: (c) => <span className="tabular-nums">{c.row.original.radiatorKPerWAtMinFan} → {c.row.original.radiatorKPerWAtMaxFan}</span>,
  },
  {
    id: "profiles",
    header: "Profiles",
    enableSorting: false,
    cell: (c) => (
      <Link className="text-copper-700 underline" href={`/profiles?coolerModelId=${c.row.original.id}`}>
        {c.row.original.profileCount} <span className="sr-only">profiles of {c.row.original.name}</span>
      </Link>
    ),
  },
];

function editColumn(onEdit: (c: CoolerModelView) => void): ColumnDef<CoolerModelView> {
  return {
    id: "edit",
    header: () => <span className="sr-only">Actions</span>,
    enableSorting: false,
    cell: (c) => (
      <Button variant="quiet" onClick={() => onEdit(c.row.original)}>
        Edit <span className="sr-only">{c.row.original.name}</span>
      </Button>
    ),
  };
}

/** `query`: the API query the page read from the URL on the server (values the API refuses dropped), so both name the same answer. */
export function CoolerModelsList({ canWrite, query }: { canWrite: boolean; query: CoolerModelsQuery }) {
  const list = useListParams(COOLER_FILTERS);
  const [editing, setEditing] = useState<CoolerModelView | null>(null);
  const shown = useMemo(() => (canWrite ? [...columns, editColumn(setEditing)] : columns), [canWrite]);
  const q = useQuery(apiQuery(listCoolerModels, { query }));
  return (
    <div className="space-y-5">
      <Panel title="Cooler models">
        <FilterBar fields={[...COOLER_FILTERS]} onApply={list.set}>
          <label className="text-sm">
            <span className="mb-1 block font-medium text-ink-800">Name contains</span>
            <Input name="q" defaultValue={list.sp.get("q") ?? ""} className="w-56" />
          </label>
        </FilterBar>
        <DataTable
          caption="Cooler models"
          columns={shown}
          {...serverTableProps(list, q)}
        />
      </Panel>
      {canWrite && editing && <CoolerModelForm key={editing.id} editing={editing} onDone={() => setEditing(null)} />}
      {canWrite && <CoolerModelForm />}
    </div>
  );
}
