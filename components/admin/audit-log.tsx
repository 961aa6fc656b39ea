"use client";

import { useQuery } from "@tanstack/react-query";
import { useUrlParams } from "@/components/ui/use-url-params";
import { apiQuery, queryFromUrl } from "@/lib/api/client";
import { AUDIT_FILTERS, pagedQueryFromUrl } from "@/lib/api/screen-queries";
import { formText } from "@/components/ui/form-data";
import { auditQuery, listAudit } from "@/lib/api/operations/admin";
import { Button } from "@/components/ui/button";
import { Input } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";
import { EmptyRow, ErrorRow, SkeletonRows, Table, Td, Th } from "@/components/ui/table";
import { Pager } from "@/components/ui/pager";

const FILTERS = [
  { key: "action", label: "Action contains" },
  { key: "entityType", label: "Entity type" },
  { key: "actor", label: "Who" },
] as const;

export function AuditLog() {
  const { sp, set: setParams } = useUrlParams();
  // The same reading of the URL the page made on the server for the first page it rendered.
  const raw = pagedQueryFromUrl(AUDIT_FILTERS, sp);
  const page = Number(raw.page);
  const q = useQuery(apiQuery(listAudit, { query: queryFromUrl(auditQuery, raw) }));


  return (
    <Panel>
      <form
        className="mb-4 flex flex-wrap items-end gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          const fd = new FormData(e.currentTarget);
          setParams({ ...Object.fromEntries(FILTERS.map((f) => [f.key, formText(fd, f.key)])), page: "" });
        }}
      >
        {FILTERS.map((f) => (
          <label key={f.key} className="text-sm">
            <span className="mb-1 block font-medium text-ink-800">{f.label}</span>
            <Input name={f.key} defaultValue={sp.get(f.key) ?? ""} className="w-48" />
          </label>
        ))}
        <Button type="submit" variant="secondary">Filter</Button>
      </form>
      <Table caption="Audit events">
        <thead>
          <tr>
            <Th>When (UTC)</Th>
            <Th>Who</Th>
            <Th>Action</Th>
            <Th>Entity</Th>
            <Th>Change</Th>
          </tr>
        </thead>
        <tbody>
          {q.isPending && <SkeletonRows cols={5} />}
          {q.isError && <ErrorRow colSpan={5} error={q.error} onRetry={() => void q.refetch()} />}
          {q.data?.items.length === 0 && <EmptyRow colSpan={5}>No events match.</EmptyRow>}
          {q.data?.items.map((e) => (
            <tr key={e.id}>
              <Td className="whitespace-nowrap tabular-nums">{e.createdAt.slice(0, 19).replace("T", " ")}</Td>
              <Td>{e.actorLabel}</Td>
              <Td><code className="text-xs">{e.action}</code></Td>
              <Td className="text-xs">{e.entityType} <span className="text-ink-500">{e.entityId.slice(0, 8)}</span></Td>
              <Td>
                <details className="text-xs">
                  <summary className="cursor-pointer text-ink-700">before / after</summary>
                  <pre className="mt-1 max-w-xl overflow-x-auto whitespace-pre-wrap rounded bg-ink-50 p-2">{JSON.stringify({ before: e.before, after: e.after }, null, 2)}</pre>
                </details>
              </Td>
            </tr>
          ))}
        </tbody>
      </Table>
      <Pager page={page} hasMore={q.data?.hasMore} previousLabel="Newer" nextLabel="Older" label="Audit pages" />
    </Panel>
  );
}
