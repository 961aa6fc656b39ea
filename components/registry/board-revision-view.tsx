"use client";

import dynamic from "next/dynamic";
import { useQuery } from "@tanstack/react-query";
import Link from "next/link";
import { useState } from "react";
import { apiQuery } from "@/lib/api/client";
import { getBoardRevision } from "@/lib/api/endpoints";
import { Button } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import { EmptyRow, SkeletonRows, Table, Td, Th } from "@/components/ui/table";
import { CompatibilityMatrix } from "./compatibility-matrix";
import { hex32 } from "@/lib/hex/address";
import { ErrorNotice } from "@/components/ui/error-notice";

// The edit form (react-hook-form) loads when someone chooses to edit.
const BoardRevisionEditForm = dynamic(() => import("./board-forms").then((m) => m.BoardRevisionEditForm));

export function BoardRevisionView({ id, canWrite }: { id: string; canWrite: boolean }) {
  const q = useQuery(apiQuery(getBoardRevision, { params: { id } }));
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
    ["Base address", hex32(r.baseAddress)],
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
        <p className="mt-3 max-w-3xl text-sm text-ink-700" data-testid="tach-explanation">
          Why {r.tachPulsesPerRev} tach pulses: the board&apos;s tach input counts {r.tachPulsesPerRev} pulses per revolution, the 4-wire fan standard (2 per revolution; Intel 4-Wire PWM fan
          specification rev 1.3, §2.1.3), because the fans it reads give that. A pump motor often gives 4 pulses per revolution (see its part under Components), so the board, and a
          motherboard reading the pump, show that pump at {r.tachPulsesPerRev === 2 ? "twice" : `${4 / r.tachPulsesPerRev} ×`} its real speed: real = reading × {r.tachPulsesPerRev} ÷ the pump&apos;s pulses. The tach converter on the serial lookup page (support) does this sum.
        </p>
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
