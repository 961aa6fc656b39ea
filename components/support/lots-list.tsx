"use client";

import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { useUrlParams } from "@/components/ui/use-url-params";
import { apiQuery } from "@/lib/api/client";
import { listLots } from "@/lib/api/endpoints";
import type { LotOptions, LotsQuery } from "@/lib/api/operations/support";
import { LOT_FILTERS, pagedQueryFromUrl } from "@/lib/api/screen-queries";
import { formText } from "@/components/ui/form-data";
import { Button } from "@/components/ui/button";
import { Input, Select } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";
import { EmptyRow, ErrorRow, SkeletonRows, Table, Td, Th } from "@/components/ui/table";
import { Pager } from "@/components/ui/pager";
import { StageBadge } from "@/components/ui/stage-badge";

const SORTS = [
  { value: "serial", label: "First serial" },
  { value: "produced", label: "Production date" },
  { value: "code", label: "Lot code" },
] as const;

/** `query`: the API query the page read from the URL on the server (values the API refuses dropped), so both name the same answer. */
export function LotsList({ options, query }: { options: LotOptions | undefined; query: LotsQuery }) {
  const { sp, set: setParams } = useUrlParams();
  const page = Number(pagedQueryFromUrl(LOT_FILTERS, sp).page);
  const q = useQuery(apiQuery(listLots, { query }));
  const builds = (options?.boardModels ?? []).flatMap((m) => m.builds.map((b) => ({ ...b, model: m.name })));


  return (
    <Panel title="Lots">
      <form
        className="mb-4 flex flex-wrap items-end gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          const fd = new FormData(e.currentTarget);
          setParams({ board: formText(fd, "board"), build: formText(fd, "build"), code: formText(fd, "code"), sort: formText(fd, "sort"), dir: formText(fd, "dir"), page: "" });
        }}
      >
        <label className="text-sm">
          <span className="mb-1 block font-medium text-ink-800">Board model</span>
          <Select name="board" defaultValue={sp.get("board") ?? ""} className="w-56">
            <option value="">All</option>
            {options?.boardModels.map((m) => <option key={m.id} value={m.id}>{m.name}</option>)}
          </Select>
        </label>
        <label className="text-sm">
          <span className="mb-1 block font-medium text-ink-800">Build</span>
          <Select name="build" defaultValue={sp.get("build") ?? ""} className="w-56">
            <option value="">All</option>
            {builds.map((b) => <option key={b.id} value={b.id}>{b.model} {b.version} ({b.stage})</option>)}
          </Select>
        </label>
        <label className="text-sm">
          <span className="mb-1 block font-medium text-ink-800">Lot code contains</span>
          <Input name="code" defaultValue={sp.get("code") ?? ""} className="w-40" />
        </label>
        <label className="text-sm">
          <span className="mb-1 block font-medium text-ink-800">Sort by</span>
          <Select name="sort" defaultValue={sp.get("sort") ?? "serial"} className="w-40">
            {SORTS.map((s) => <option key={s.value} value={s.value}>{s.label}</option>)}
          </Select>
        </label>
        <label className="text-sm">
          <span className="mb-1 block font-medium text-ink-800">Order</span>
          <Select name="dir" defaultValue={sp.get("dir") ?? "asc"} className="w-32">
            <option value="asc">Ascending</option>
            <option value="desc">Descending</option>
          </Select>
        </label>
        <Button type="submit" variant="secondary">Apply</Button>
      </form>
      <Table caption="Production lots">
        <thead>
          <tr>
            <Th>Lot</Th>
            <Th>Board</Th>
            <Th>Serials</Th>
            <Th>Boards</Th>
            <Th>Build</Th>
            <Th>Produced</Th>
          </tr>
        </thead>
        <tbody>
          {q.isPending && <SkeletonRows cols={6} />}
          {q.isError && <ErrorRow colSpan={6} error={q.error} onRetry={() => void q.refetch()} />}
          {q.data?.items.length === 0 && <EmptyRow colSpan={6}>No lots match.</EmptyRow>}
          {q.data?.items.map((l) => (
            <tr key={l.id}>
              <Td className="font-medium">{l.lotCode}</Td>
              <Td>{l.boardModelName} <span className="text-ink-600">rev {l.revision}</span></Td>
              <Td className="whitespace-nowrap font-mono text-xs">{l.serialFrom} – {l.serialTo}</Td>
              <Td className="tabular-nums">{l.boards.toLocaleString("en")}</Td>
              <Td className="whitespace-nowrap">
                <Link href={`/builds/${l.buildId}`} className="text-coolant-700 underline underline-offset-2">Build {l.buildVersion}</Link> <StageBadge stage={l.buildStage} />
              </Td>
              <Td className="whitespace-nowrap">{l.producedOn} · {l.line}</Td>
            </tr>
          ))}
        </tbody>
      </Table>
      <Pager page={page} hasMore={q.data?.hasMore} label="Lot pages" />
    </Panel>
  );
}
