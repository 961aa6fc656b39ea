"use client";

import dynamic from "next/dynamic";
import { useQuery } from "@tanstack/react-query";
import { hex32 } from "@/lib/hex/address";
import Link from "next/link";
import { useState } from "react";
import { apiQuery } from "@/lib/api/client";
import { listBoardModels } from "@/lib/api/endpoints";
import { Button } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import { EmptyRow, SkeletonRows, Table, Td, Th } from "@/components/ui/table";
import { BoardSigningKeys } from "./board-signing-keys";
import { ErrorNotice } from "@/components/ui/error-notice";

// The form (react-hook-form) is its own chunk, loaded only when the page shows it (people who may write).
const BoardModelForm = dynamic(() => import("./board-forms").then((m) => m.BoardModelForm));
const BoardRevisionForm = dynamic(() => import("./board-forms").then((m) => m.BoardRevisionForm));

export function BoardsView({ canWrite }: { canWrite: boolean }) {
  const q = useQuery(apiQuery(listBoardModels, {}));
  const [editingId, setEditingId] = useState<string | null>(null);
  return (
    <div className="space-y-5">
      {q.isPending && (
        <Panel title="Board models">
          <Table caption="Loading board models"><tbody><SkeletonRows cols={6} /></tbody></Table>
        </Panel>
      )}
      {q.isError && (
        <Panel title="Board models">
          <ErrorNotice error={q.error} onRetry={() => void q.refetch()} />
        </Panel>
      )}
      {q.data?.items.map((b) => (
        <Panel key={b.id} title={`${b.name} · serial prefix ${b.serialPrefix}`}>
          {b.description && <p className="mb-3 text-sm text-ink-700">{b.description}</p>}
          {canWrite && editingId !== b.id && (
            <div className="mb-3">
              <Button variant="secondary" onClick={() => setEditingId(b.id)}>
                Edit board model <span className="sr-only">{b.name}</span>
              </Button>
            </div>
          )}
          {canWrite && editingId === b.id && (
            <div className="mb-3">
              <BoardModelForm editing={b} onDone={() => setEditingId(null)} />
            </div>
          )}
          <Table caption={`Revisions of ${b.name}`}>
            <thead>
              <tr>
                <Th>Revision</Th>
                <Th>Profile memory</Th>
                <Th>Base address</Th>
                <Th>Slots</Th>
                <Th>Points per curve</Th>
                <Th>PWM / tach</Th>
                <Th>Notes</Th>
              </tr>
            </thead>
            <tbody>
              {b.revisions.length === 0 && <EmptyRow colSpan={7}>No revisions yet.</EmptyRow>}
              {b.revisions.map((r) => (
                <tr key={r.id}>
                  <Td>
                    <Link className="font-medium text-copper-700 underline" href={`/board-revisions/${r.id}`}>
                      {r.revision}
                    </Link>
                  </Td>
                  <Td className="tabular-nums">{r.memoryBytes} B</Td>
                  <Td className="font-mono text-xs">{hex32(r.baseAddress)}</Td>
                  <Td className="tabular-nums">{r.slotCount}</Td>
                  <Td className="tabular-nums">{r.maxPointsPerCurve}</Td>
                  <Td className="tabular-nums">{r.pwmFrequencyHz / 1000} kHz · {r.tachPulsesPerRev} p/rev</Td>
                  <Td className="text-ink-700">{r.notes}</Td>
                </tr>
              ))}
            </tbody>
          </Table>
          <BoardSigningKeys boardModelId={b.id} boardName={b.name} />
        </Panel>
      ))}
      {canWrite && q.data && (
        <div className="grid gap-5 lg:grid-cols-2">
          <BoardModelForm />
          <BoardRevisionForm boardModels={q.data.items} />
        </div>
      )}
    </div>
  );
}
