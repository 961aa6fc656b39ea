"use client";

import { useQuery } from "@tanstack/react-query";
import { useSearchParams } from "next/navigation";
import { apiQuery } from "@/lib/api/client";
import { listMailbox } from "@/lib/api/endpoints";
import { Panel } from "@/components/ui/panel";
import { EmptyRow, ErrorRow, SkeletonRows, Table, Td, Th } from "@/components/ui/table";
import { Pager } from "@/components/ui/pager";
import { formatUtc } from "@/lib/time/format";

export function Mailbox() {
  const sp = useSearchParams();
  const page = Math.max(1, Number(sp.get("page") ?? "1") || 1);
  const q = useQuery({
    ...apiQuery(listMailbox, { query: { page } }),
    refetchInterval: 5000,
  });
  return (
    <Panel>
      <Table caption="Received messages">
        <thead>
          <tr>
            <Th>Received</Th>
            <Th>To</Th>
            <Th>Subject and body</Th>
          </tr>
        </thead>
        <tbody>
          {q.isPending && <SkeletonRows cols={3} />}
          {q.isError && <ErrorRow colSpan={3} error={q.error} onRetry={() => void q.refetch()} />}
          {q.data?.items.length === 0 && <EmptyRow colSpan={3}>No messages yet.</EmptyRow>}
          {q.data?.items.map((m) => (
            <tr key={m.id} data-testid="mail-row">
              <Td className="whitespace-nowrap tabular-nums">{formatUtc(m.receivedAt, "second")}</Td>
              <Td className="text-xs">{m.toAddresses.join(", ")}</Td>
              <Td>
                <details>
                  <summary className="cursor-pointer font-medium text-ink-900">{m.subject || "(no subject)"}</summary>
                  <pre className="mt-1 max-w-2xl overflow-x-auto whitespace-pre-wrap rounded bg-ink-50 p-2 text-xs">{m.body}</pre>
                </details>
              </Td>
            </tr>
          ))}
        </tbody>
      </Table>
      <Pager page={page} hasMore={q.data?.hasMore} previousLabel="Newer" nextLabel="Older" label="Mailbox pages" />
    </Panel>
  );
}
