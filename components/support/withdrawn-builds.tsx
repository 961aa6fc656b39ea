"use client";

import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { apiQuery } from "@/lib/api/client";
import { getShippedWithBuild, listWithdrawnBuilds } from "@/lib/api/endpoints";
import { buttonClass } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import { EmptyRow, ErrorRow, SkeletonRows, Table, Td, Th } from "@/components/ui/table";
import { ErrorNotice } from "@/components/ui/error-notice";
import { formatUtc } from "@/lib/time/format";


export function WithdrawnBuilds() {
  const sp = useSearchParams();
  const router = useRouter();
  const pathname = usePathname();
  const selected = sp.get("build");
  const list = useQuery(apiQuery(listWithdrawnBuilds, {}));
  const shipped = useQuery({
    ...apiQuery(getShippedWithBuild, { params: { id: selected ?? "" } }),
    enabled: Boolean(selected),
  });
  return (
    <div className="space-y-5">
      <Panel title="Withdrawn builds">
        <Table caption="Withdrawn builds">
          <thead>
            <tr><Th>Build</Th><Th>Withdrawn</Th><Th>Reason</Th><Th>Lots</Th><Th>Boards shipped</Th><Th /></tr>
          </thead>
          <tbody>
            {list.isPending && <SkeletonRows cols={6} rows={2} />}
            {list.isError && <ErrorRow colSpan={6} error={list.error} onRetry={() => void list.refetch()} />}
            {list.data?.items.length === 0 && <EmptyRow colSpan={6}>No build has been withdrawn.</EmptyRow>}
            {list.data?.items.map((b) => (
              <tr key={b.id} aria-current={b.id === selected ? "true" : undefined} className={b.id === selected ? "bg-copper-50" : ""}>
                <Td className="whitespace-nowrap font-medium">
                  <Link className="text-copper-700 underline" href={`/builds/${b.id}`}>{b.boardModelName} {b.version}</Link>
                </Td>
                <Td className="whitespace-nowrap text-sm">
                  <span data-testid="withdrawn-when">
                    {b.withdrawnAt ? <>{formatUtc(b.withdrawnAt)}<span className="block text-xs text-ink-600">by {b.withdrawnByName ?? "a deleted user"}</span></> : "—"}
                  </span>
                </Td>
                <Td>{b.withdrawnReason}</Td>
                <Td className="tabular-nums">{b.lots}</Td>
                <Td className="tabular-nums">{b.boards.toLocaleString("en")}</Td>
                <Td><button className="underline" onClick={() => router.replace(`${pathname}?build=${b.id}`)}>Show lots</button></Td>
              </tr>
            ))}
          </tbody>
        </Table>
      </Panel>
      {selected && (
        <Panel
          title={shipped.data ? `Shipped with ${shipped.data.build.boardModelName} ${shipped.data.build.version}` : "Shipped lots"}
          actions={<a className={buttonClass("secondary")} href={`/api/v1/support/withdrawn/${selected}/shipped.csv`} download>Export CSV</a>}
        >
          {shipped.isError && <ErrorNotice error={shipped.error} onRetry={() => void shipped.refetch()} />}
          {shipped.data && <p className="mb-3 text-sm text-ink-800">{shipped.data.boards.toLocaleString("en")} boards in {shipped.data.lots.length} lot(s).</p>}
          <Table caption="Lots shipped with the build">
            <thead>
              <tr><Th>Lot</Th><Th>Revision</Th><Th>Serials</Th><Th>Boards</Th><Th>Produced</Th></tr>
            </thead>
            <tbody>
              {shipped.isPending && <SkeletonRows cols={5} rows={2} />}
              {shipped.data?.lots.length === 0 && <EmptyRow colSpan={5}>No lots shipped with this build.</EmptyRow>}
              {shipped.data?.lots.map((l) => (
                <tr key={l.lotCode}>
                  <Td className="font-medium">{l.lotCode}</Td>
                  <Td>{l.revision}</Td>
                  <Td className="whitespace-nowrap font-mono text-xs">{l.serialFrom} – {l.serialTo}</Td>
                  <Td className="tabular-nums">{l.boards.toLocaleString("en")}</Td>
                  <Td>{l.producedOn} · {l.line}</Td>
                </tr>
              ))}
            </tbody>
          </Table>
        </Panel>
      )}
    </div>
  );
}
