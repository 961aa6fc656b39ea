"use client";

import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { useUrlParams } from "@/components/ui/use-url-params";
import { apiQuery } from "@/lib/api/client";
import { AUDIT_FILTERS, pagedQueryFromUrl } from "@/lib/api/screen-queries";
import { formText } from "@/components/ui/form-data";
import { listAudit } from "@/lib/api/endpoints";
import type { AuditQuery } from "@/lib/api/operations/admin";
import { Button } from "@/components/ui/button";
import { Input } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";
import { EmptyRow, ErrorRow, SkeletonRows, Table, Td, Th } from "@/components/ui/table";
import { Pager } from "@/components/ui/pager";
import { formatUtc } from "@/lib/time/format";

const FILTERS = [
  { key: "action", label: "Action contains", type: "text", hint: "e.g. user.disable" },
  { key: "entityType", label: "Entity type", type: "text", hint: "e.g. build" },
  { key: "actor", label: "Who", type: "text", hint: "Name or e-mail" },
  { key: "from", label: "From (UTC day)", type: "date", hint: undefined },
  { key: "to", label: "To (UTC day)", type: "date", hint: undefined },
] as const;

/** Actions worth picking by name; the filter still takes any part of an action. */
const KNOWN_ACTIONS = ["profile_version.publish", "build.create", "build.promote", "build.withdraw", "lot.import", "user.create", "user.role_change", "user.disable", "user.enable", "token.create", "token.revoke"];

/** `query`: the API query the page read from the URL on the server (values the API refuses dropped), so both name the same answer. */
export function AuditLog({ query }: { query: AuditQuery }) {
  const { sp, set: setParams } = useUrlParams();
  const page = Number(pagedQueryFromUrl(AUDIT_FILTERS, sp).page);
  const q = useQuery(apiQuery(listAudit, { query }));


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
            <Input
              name={f.key}
              type={f.type}
              defaultValue={sp.get(f.key) ?? ""}
              className={f.type === "date" ? "w-40" : "w-48"}
              placeholder={f.hint}
              list={f.key === "action" ? "audit-actions" : undefined}
            />
          </label>
        ))}
        <datalist id="audit-actions">
          {KNOWN_ACTIONS.map((a) => <option key={a} value={a} />)}
        </datalist>
        <Button type="submit" variant="secondary">Filter</Button>
      </form>
      <Table caption="Audit events">
        <thead>
          <tr>
            <Th>When</Th>
            <Th>What happened</Th>
            <Th>Changed</Th>
            <Th>Before / after</Th>
          </tr>
        </thead>
        <tbody>
          {q.isPending && <SkeletonRows cols={4} />}
          {q.isError && <ErrorRow colSpan={4} error={q.error} onRetry={() => void q.refetch()} />}
          {q.data?.items.length === 0 && <EmptyRow colSpan={4}>No events match.</EmptyRow>}
          {q.data?.items.map((e) => (
            <tr key={e.id}>
              <Td className="whitespace-nowrap tabular-nums">{formatUtc(e.createdAt, "second")}</Td>
              <Td>
                {e.sentence}
                <span className="block text-xs text-ink-600">
                  <code>{e.action}</code>
                  {e.actorName !== e.actorLabel && <> · {e.actorLabel}</>}
                </span>
              </Td>
              <Td className="text-sm">
                {e.subject?.href ? (
                  <Link className="text-copper-700 underline" href={e.subject.href}>{e.subject.label}</Link>
                ) : (
                  e.subject?.label ?? <span className="text-xs text-ink-600">{e.entityType} {e.entityId.slice(0, 8)} (no longer exists)</span>
                )}
              </Td>
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
