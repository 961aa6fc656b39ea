"use client";

import dynamic from "next/dynamic";
import { useQuery } from "@tanstack/react-query";
import type { ColumnDef } from "@tanstack/react-table";
import { apiQuery } from "@/lib/api/client";
import { listComponents } from "@/lib/api/endpoints";
import type { ComponentView } from "@/lib/api/operations/registry-schemas";
import type { ComponentsQuery } from "@/lib/api/operations/registry";
import { COMPONENT_FILTERS } from "@/lib/api/screen-queries";
import { Badge } from "@/components/ui/badge";
import { Input, Select } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";
import { DataTable } from "./data-table";
import { FilterBar } from "./filter-bar";
import { useListParams, serverTableProps } from "./use-list-params";

// The form (react-hook-form) is its own chunk, loaded only when the page shows it (people who may write).
const ComponentForm = dynamic(() => import("./component-form").then((m) => m.ComponentForm));

const columns: ColumnDef<ComponentView>[] = [
  { id: "name", accessorKey: "name", header: "Name", cell: (c) => <span className="font-medium">{c.row.original.name}</span> },
  { id: "kind", accessorKey: "kind", header: "Kind", cell: (c) => <Badge tone={c.row.original.kind === "pump" ? "info" : "neutral"}>{c.row.original.kind}</Badge> },
  { id: "minDutyPct", accessorKey: "minDutyPct", header: "Min duty %", cell: (c) => <span className="tabular-nums">{c.row.original.minDutyPct}</span> },
  { id: "rpm", header: "RPM at min → max", enableSorting: false, cell: (c) => <span className="tabular-nums">{c.row.original.rpmAtMinDuty} → {c.row.original.maxRpm}</span> },
  { id: "maxRpm", accessorKey: "maxRpm", header: "Max RPM", cell: (c) => <span className="tabular-nums">{c.row.original.maxRpm}</span> },
  {
    id: "refSoundDbA",
    accessorKey: "refSoundDbA",
    header: "Sound dB(A) @ ref RPM",
    cell: (c) => {
      const t = c.row.original.soundTable;
      return <span className="tabular-nums">{t ? `measured table, ${t.points.length} points at ${t.distanceM} m` : `${c.row.original.refSoundDbA} @ ${c.row.original.refRpm}`}</span>;
    },
  },
  { id: "belowMin", header: "At 0 % duty", enableSorting: false, cell: (c) => (c.row.original.stopsAtZeroDuty ? "stops" : "keeps min RPM") },
  { id: "tach", header: "Tach pulses/rev", enableSorting: false, cell: (c) => <span className="tabular-nums">{c.row.original.tachPulsesPerRev}</span> },
  { id: "flow", header: "Flow at max (L/min)", enableSorting: false, cell: (c) => <span className="tabular-nums">{c.row.original.flowAtMaxRpmLpm ?? "—"}</span> },
];

/** `query`: the API query the page read from the URL on the server (values the API refuses dropped), so both name the same answer. */
export function ComponentsList({ canWrite, query }: { canWrite: boolean; query: ComponentsQuery }) {
  const list = useListParams(COMPONENT_FILTERS);
  const q = useQuery(apiQuery(listComponents, { query }));
  return (
    <div className="space-y-5">
      <Panel title="Fans and pumps">
        <FilterBar fields={[...COMPONENT_FILTERS]} onApply={list.set}>
          <label className="text-sm">
            <span className="mb-1 block font-medium text-ink-800">Name contains</span>
            <Input name="q" defaultValue={list.sp.get("q") ?? ""} className="w-56" />
          </label>
          <label className="text-sm">
            <span className="mb-1 block font-medium text-ink-800">Kind</span>
            <Select name="kind" defaultValue={list.sp.get("kind") ?? ""} className="w-32">
              <option value="">Any</option>
              <option value="fan">Fan</option>
              <option value="pump">Pump</option>
            </Select>
          </label>
        </FilterBar>
        <DataTable
          caption="Components"
          columns={columns}
          {...serverTableProps(list, q)}
        />
      </Panel>
      {canWrite && <ComponentForm />}
    </div>
  );
}
