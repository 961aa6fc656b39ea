"use client";

import { useQuery } from "@tanstack/react-query";
import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { apiQuery } from "@/lib/api/client";
import { listMailbox } from "@/lib/api/operations/builds";
import { Button } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import { EmptyRow, SkeletonRows, Table, Td, Th } from "@/components/ui/table";
import { formatUtc } from "@/lib/time/format";

export function Mailbox() {
  const sp = useSearchParams();
  const router = useRouter();
  const pathname = usePathname();
  const page = Math.max(1, Number(sp.get("page") ?? "1") || 1);
  const q = useQuery({
    ...apiQuery(listMailbox, { query: { page } }),
    refetchInterval: 5000,
  });
  const go = (p: number) => router.replace(`${pathname}?page=${p}`);
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
          {q.isError && (
            <EmptyRow colSpan={3}>
              Could not load the mailbox. <button className="underline" onClick={() => void q.refetch()}>Retry</button>
            </EmptyRow>
          )}
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
      <div className="mt-3 flex items-center gap-2 text-sm">
        <Button variant="secondary" disabled={page <= 1} onClick={() => go(page - 1)}>Newer</Button>
        <span className="tabular-nums text-ink-600">Page {page}</span>
        <Button variant="secondary" disabled={!q.data?.hasMore} onClick={() => go(page + 1)}>Older</Button>
      </div>
    </Panel>
  );
}
