"use client";

import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { apiFetch } from "@/lib/api/client";
import { operationKey } from "@/lib/api/query-key";
import type { BoardRevisionDetail } from "@/lib/api/operations/registry";
import { Button } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import { EmptyRow, SkeletonRows, Table, Td, Th } from "@/components/ui/table";
import { BoardRevisionEditForm } from "./board-forms";
import { CompatibilityMatrix } from "./compatibility-matrix";
import { ErrorNotice } from "@/components/ui/error-notice";

export function BoardRevisionView({ id, canWrite }: { id: string; canWrite: boolean }) {
  const q = useQuery({ queryKey: operationKey("getBoardRevision", { params: { id } }), queryFn: () => apiFetch<BoardRevisionDetail>(`/api/v1/board-revisions/${id}`) });
  const [editing, setEditing] = useState(false);
  if (q.isPending) return <Panel title="Board revision"><Table caption="Loading"><tbody><SkeletonRows cols={4} rows={4} /></tbody></Table></Panel>;
  if (q.isError)
    return (
      <ErrorNotice error={q.error} onRetry={() => void q.refetch()} />
    );
  const { revision: r, boardModelName, compatibility } = q.data;
  const column = compatibility.revisions.findIndex((x) => x.id === r.id);
  const compatible = compatibility.rows.filter((row) => row.cells[column]?.ok);
  const limits: [string, string][] = [
    ["Profile memory", `${r.memoryBytes} bytes`],
    ["Base address", `0x${r.baseAddress.toString(16).toUpperCase()}`],
    ["Profile slots", String(r.slotCount)],
    ["Points per curve", `at most ${r.maxPointsPerCurve}`],
    ["PWM frequency", `${r.pwmFrequencyHz} Hz`],
    ["Tach pulses per revolution", String(r.tachPulsesPerRev)],
  ];
  return (
    <div className="space-y-5">
      <h2 className="sr-only">{boardModelName} revision {r.revision}</h2>
      <Panel title="Limits">
        <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-3">
          {limits.map(([k, v]) => (
            <div key={k}>
              <dt className="text-ink-600">{k}</dt>
              <dd className="font-medium tabular-nums text-ink-900">{v}</dd>
            </div>
          ))}
        </dl>
        {r.notes && <p className="mt-3 text-sm text-ink-700">{r.notes}</p>}
        {canWrite && !editing && (
          <div className="mt-3">
            <Button variant="secondary" onClick={() => setEditing(true)}>Edit limits</Button>
          </div>
        )}
      </Panel>
      {canWrite && editing && <BoardRevisionEditForm revision={r} onDone={() => setEditing(false)} />}
      <Panel title={`Profile versions that run on ${r.revision}`}>
        <Table caption={`Compatible profile versions for revision ${r.revision}`}>
          <thead>
            <tr>
              <Th>Profile</Th>
              <Th>Version</Th>
              <Th>Range</Th>
              <Th>Image / memory</Th>
            </tr>
          </thead>
          <tbody>
            {compatible.length === 0 && <EmptyRow colSpan={4}>No published version fits this revision.</EmptyRow>}
            {compatible.map((row) => (
              <tr key={row.versionId}>
                <Td>
                  <Link className="text-copper-700 underline" href={`/profiles/${row.profileId}`}>{row.coolerModelName} · {row.profileName}</Link>
                </Td>
                <Td className="tabular-nums">{row.version}</Td>
                <Td><code className="text-xs">{row.boardRange}</code></Td>
                <Td className="tabular-nums">{row.encodedBytes} / {r.memoryBytes} B</Td>
              </tr>
            ))}
          </tbody>
        </Table>
      </Panel>
      <Panel title={`Compatibility matrix · ${boardModelName}`}>
        <p className="mb-3 text-sm text-ink-700">Compatible means the revision satisfies the version&apos;s board range, the bank image fits the revision&apos;s memory, and its curves fit the point limit.</p>
        <CompatibilityMatrix data={compatibility} highlightRevisionId={r.id} />
      </Panel>
    </div>
  );
}
