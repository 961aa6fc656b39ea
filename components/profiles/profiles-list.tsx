"use client";

import { useMutation, useQuery } from "@tanstack/react-query";
import type { ColumnDef } from "@tanstack/react-table";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useForm } from "react-hook-form";
import { apiCall, apiQuery } from "@/lib/api/client";
import { PROFILE_FILTERS } from "@/lib/api/screen-queries";
import { createProfile, listProfiles, listCoolerModels } from "@/lib/api/endpoints";
import { ALL_COOLERS } from "@/lib/api/limits";
import type { CreateProfileBody, ProfileSummaryView } from "@/lib/api/operations/profile-schemas";
import type { CoolerModelView } from "@/lib/api/operations/registry-schemas";
import type { ProfilesQuery } from "@/lib/api/operations/profiles";
import { Button } from "@/components/ui/button";
import { lazyZodResolver } from "@/components/ui/lazy-resolver";
import { Field, Input, Select, Textarea, describedBy } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";
import { Badge } from "@/components/ui/badge";
import { DataTable } from "@/components/registry/data-table";
import { FilterBar } from "@/components/registry/filter-bar";
import { useListParams, serverTableProps } from "@/components/registry/use-list-params";
import { ErrorNotice } from "@/components/ui/error-notice";
import { fieldsOf, showServerIssues } from "@/components/ui/server-issues";
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

/** Client-side checks with the API body's own schema, loaded when the form first validates. */
const createProfileBodyResolver = lazyZodResolver(() => import("@/lib/api/operations/profile-schemas").then((m) => m.createProfileBody));

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

function CreateProfileForm({ coolers }: { coolers: CoolerModelView[] }) {
  const router = useRouter();
  const form = useForm<CreateProfileBody>({ resolver: createProfileBodyResolver, defaultValues: { description: "" } });
  const create = useMutation({
    mutationFn: (v: CreateProfileBody) => apiCall(createProfile, { body: v }),
    onSuccess: (res) => router.push(`/profiles/${res.profile.id}`),
    onError: (err) => showServerIssues(form, err),
  });
  const { errors } = form.formState;
  return (
    <Panel title="Start a profile">
      <form onSubmit={(e) => void form.handleSubmit((v) => create.mutate(v))(e)} className="grid max-w-3xl gap-3 md:grid-cols-2" noValidate>
        {create.error && <div className="md:col-span-2"><ErrorNotice error={create.error} besideFields={fieldsOf(form)} /></div>}
        <Field id="p-cooler" label="Cooler model" error={errors.coolerModelId?.message}>
          <Select {...describedBy("p-cooler", errors.coolerModelId?.message)} {...form.register("coolerModelId")}>
            <option value="">Choose…</option>
            {coolers.map((c) => <option key={c.id} value={c.id}>{c.name}</option>)}
          </Select>
        </Field>
        <Field id="p-name" label="Profile name" error={errors.name?.message}>
          <Input {...describedBy("p-name", errors.name?.message)} {...form.register("name")} />
        </Field>
        <div className="md:col-span-2">
          <Field id="p-desc" label="Description" hint="What the profile is for; shown in the list." error={errors.description?.message}>
            <Textarea rows={2} {...describedBy("p-desc", errors.description?.message)} {...form.register("description")} />
          </Field>
        </div>
        <div className="md:col-span-2">
          <Button type="submit" disabled={create.isPending}>Create and open the editor</Button>
        </div>
      </form>
    </Panel>
  );
}
