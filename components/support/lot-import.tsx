"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useId, useState } from "react";
import { apiCall, operationKey } from "@/lib/api/client";
import { importLots, listLots } from "@/lib/api/operations/support";
import { LOT_CSV_COLUMNS } from "@/lib/lots/input";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import { Table, Td, Th } from "@/components/ui/table";
import { ErrorNotice } from "@/components/ui/error-notice";

/** CSV import in two steps: a preview that checks every row, then one all-or-nothing commit. */
export function LotImport() {
  const id = useId();
  const qc = useQueryClient();
  const [text, setText] = useState<string | null>(null);
  const [fileName, setFileName] = useState("");
  const run = useMutation({
    mutationFn: ({ dryRun }: { dryRun: boolean }) =>
      apiCall(importLots, { query: { dryRun: dryRun ? "true" : "false" }, raw: { data: text ?? "", contentType: "text/csv" } }),
    onSuccess: (r) => {
      if (!r.dryRun && r.committed > 0) void qc.invalidateQueries({ queryKey: operationKey(listLots) });
    },
  });
  const r = run.data;
  return (
    <Panel title="Import lots from CSV">
      <p className="mb-3 text-sm text-ink-700">
        Columns: <code className="text-xs">{LOT_CSV_COLUMNS.map(([c]) => c).join(",")}</code>. Preview checks every row; Import records all rows in one go, or none if any row is wrong.
      </p>
      <div className="flex flex-wrap items-end gap-3">
        <div>
          <label htmlFor={`${id}-csv`} className="block text-sm font-medium text-ink-800">CSV file</label>
          <input
            id={`${id}-csv`}
            type="file"
            accept=".csv,text/csv"
            className="mt-1 block text-sm"
            onChange={async (e) => {
              const f = e.target.files?.[0];
              run.reset();
              setFileName(f?.name ?? "");
              setText(f ? await f.text() : null);
            }}
          />
        </div>
        <Button variant="secondary" disabled={text === null || run.isPending} onClick={() => run.mutate({ dryRun: true })}>Preview</Button>
        <Button disabled={text === null || run.isPending || !r?.dryRun || r.issues.length > 0} onClick={() => run.mutate({ dryRun: false })}>Import</Button>
      </div>
      {run.error && <div className="mt-3"><ErrorNotice error={run.error} /></div>}
      {r && r.issues.length > 0 && (
        <div className="mt-3 space-y-2">
          <Notice tone="fault" role="alert" title={`${fileName || "The file"}: ${r.issues.length} problem(s); nothing was imported`}>Fix these rows and preview again.</Notice>
          <Table caption="Problems by row">
            <thead>
              <tr><Th>Row</Th><Th>Column</Th><Th>Problem</Th></tr>
            </thead>
            <tbody>
              {r.issues.map((i, n) => (
                <tr key={n}><Td className="tabular-nums">{i.row}</Td><Td><code className="text-xs">{i.column || "—"}</code></Td><Td>{i.message}</Td></tr>
              ))}
            </tbody>
          </Table>
        </div>
      )}
      {r && r.issues.length === 0 && r.dryRun && <div className="mt-3"><Notice tone="ok" role="status">All {r.checked} row(s) are valid. Nothing is recorded until you press Import.</Notice></div>}
      {r && r.issues.length === 0 && !r.dryRun && <div className="mt-3"><Notice tone="ok" role="status">Imported {r.committed} lot(s).</Notice></div>}
    </Panel>
  );
}
