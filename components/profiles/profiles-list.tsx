"use client";

import { useQuery } from "@tanstack/react-query";
import type { ColumnDef } from "@tanstack/react-table";
import dynamic from "next/dynamic";
import Link from "next/link";
import { apiQuery } from "@/lib/api/client";
import { PROFILE_FILTERS } from "@/lib/api/screen-queries";
import { listProfiles, listCoolerModels } from "@/lib/api/endpoints";
import { ALL_COOLERS } from "@/lib/api/limits";
import type { ProfileSummaryView } from "@/lib/api/operations/profile-schemas";
import type { ProfilesQuery } from "@/lib/api/operations/profiles";
import { Input, Select } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";
import { Badge } from "@/components/ui/badge";
import { DataTable } from "@/components/registry/data-table";
import { FilterBar } from "@/components/registry/filter-bar";
import { useListParams, serverTableProps } from "@/components/registry/use-list-params";
import { formatUtc } from "@/lib/time/format";

const columns: ColumnDef<ProfileSummaryView>[] = [
  {
    id: "name",
    accessorKey: "name",
    header: "Profile",
    cell: (c) => (
      <Link className="font-medium text-copper-700 underline" href={`/profiles/${c.row.original.id}`}>
        {c.row.original.name}
      </Link>
    ),
  },
  { id: "coolerModel", accessorKey: "coolerModelName", header: "Cooler model" },
  { id: "latest", header: "Latest version", enableSorting: false, cell: (c) => (c.row.original.latestVersion ? <Badge tone="accent">{c.row.original.latestVersion}</Badge> : <Badge>draft only</Badge>) },
  { id: "versions", header: "Versions", enableSorting: false, cell: (c) => <span className="tabular-nums">{c.row.original.versionCount}</span> },
  { id: "owner", header: "Owner", enableSorting: false, cell: (c) => c.row.original.ownerName },
  { id: "updatedAt", accessorKey: "updatedAt", header: "Updated", cell: (c) => <span className="tabular-nums">{formatUtc(c.row.original.updatedAt)}</span> },
];

// The form (react-hook-form) is its own chunk, loaded only when the page shows it (people who may write).
const CreateProfileForm = dynamic(() => import("./create-profile-form").then((m) => m.CreateProfileForm));

/** `query`: the API query the page read from the URL on the server (values the API refuses dropped), so both name the same answer. */
export function ProfilesList({ canWrite, query }: { canWrite: boolean; query: ProfilesQuery }) {
  const list = useListParams(PROFILE_FILTERS);
  const coolers = useQuery(apiQuery(listCoolerModels, { query: ALL_COOLERS }));
  const q = useQuery(apiQuery(listProfiles, { query }));
  return (
    <div className="space-y-5">
      <Panel title="Profiles">
        <FilterBar fields={[...PROFILE_FILTERS]} onApply={list.set}>
          <label className="text-sm">
            <span className="mb-1 block font-medium text-ink-800">Name contains</span>
            <Input name="q" defaultValue={list.sp.get("q") ?? ""} className="w-56" />
          </label>
          <label className="text-sm">
            <span className="mb-1 block font-medium text-ink-800">Cooler model</span>
            <Select name="coolerModelId" defaultValue={list.sp.get("coolerModelId") ?? ""} className="w-48" key={coolers.data ? "loaded" : "loading"}>
              <option value="">Any</option>
              {coolers.data?.items.map((c) => <option key={c.id} value={c.id}>{c.name}</option>)}
            </Select>
          </label>
        </FilterBar>
        <DataTable
          caption="Profiles"
          columns={columns}
          {...serverTableProps(list, q)}
        />
      </Panel>
      {canWrite && <CreateProfileForm coolers={coolers.data?.items ?? []} />}
    </div>
  );
}
