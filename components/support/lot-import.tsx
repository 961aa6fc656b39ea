"use client";

import { useQueryClient } from "@tanstack/react-query";
import { useId, useState } from "react";
import { apiUpload, operationKey } from "@/lib/api/client";
import { AppError } from "@/lib/api/errors";
import { importLotsWithProgress, listLots } from "@/lib/api/endpoints";
import { MAX_LOTS_CSV_BYTES } from "@/lib/api/limits";
import type { ImportResult } from "@/lib/api/operations/support";
import { LOT_CSV_COLUMNS } from "@/lib/lots/csv-columns";
import { IMPORT_PROGRESS_TYPE, importEventsIn, importPercent } from "@/lib/lots/import-events";
import { formatBytes } from "@/lib/units/bytes";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { FilePicker } from "@/components/ui/file-picker";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import { Table, Td, Th } from "@/components/ui/table";
import { ErrorNotice } from "@/components/ui/error-notice";
import { UploadProgressBar } from "@/components/ui/upload-progress";
import { useUpload } from "@/components/ui/use-upload";

/** Rows of problems listed on screen; a file with more says how many were left out. */
const SHOWN_ISSUES = 200;

/**
 * CSV import in two steps: a preview that checks every row, then one all-or-nothing commit.
 * Files of up to 100,000 lots: the file is sent as it is, with a progress bar while it goes
 * out and while the server checks and writes the rows; Cancel stops it and records nothing.
 */
export function LotImport() {
  const id = useId();
  const qc = useQueryClient();
  const [file, setFile] = useState<File | null>(null);
  const [result, setResult] = useState<ImportResult | null>(null);
  const [error, setError] = useState<AppError | null>(null);
  const upload = useUpload();

  async function run(dryRun: boolean) {
    if (!file) return;
    setError(null);
    setResult(null);
    try {
      const r = await upload.run(file.name, async ({ signal, onProgress, processing }) => {
        // Filled from the streamed lines; XHR's progress callbacks cannot reject the call themselves.
        const outcome: { result?: ImportResult; error?: AppError } = {};
        let seen = 0;
        await apiUpload(
          importLotsWithProgress,
          { query: { dryRun: dryRun ? "true" : "false" }, raw: { data: file, contentType: "text/csv" } },
          {
            accept: IMPORT_PROGRESS_TYPE,
            signal,
            onProgress,
            onText: (text) => {
              const events = importEventsIn(text);
              for (const e of events.slice(seen)) {
                if (e.type === "progress") {
                  const what = e.phase === "parsing" ? "Reading the file" : e.phase === "checking" ? "Checking rows" : "Recording lots";
                  processing(e.total > 0 ? `${what}: ${e.done.toLocaleString("en")} of ${e.total.toLocaleString("en")}` : what, importPercent(e, dryRun));
                } else if (e.type === "result") {
                  outcome.result = e.result;
                } else {
                  outcome.error = new AppError(e.body.error.code, e.body.error.message, { issues: e.body.error.issues });
                }
              }
              seen = events.length;
            },
          },
        );
        if (outcome.error) throw outcome.error;
        if (!outcome.result) throw new AppError("internal", "The import ended without a result; nothing is known to be recorded. Preview again.");
        return outcome.result;
      });
      if (!r) return;
      setResult(r);
      if (!r.dryRun && r.committed > 0) void qc.invalidateQueries({ queryKey: operationKey(listLots) });
    } catch (err) {
      setError(err instanceof AppError ? err : new AppError("internal", "The import failed; nothing was recorded."));
    }
  }

  const tooLarge = file !== null && file.size > MAX_LOTS_CSV_BYTES;
  const r = result;
  return (
    <Panel title="Import lots from CSV">
      <p className="mb-3 text-sm text-ink-700">
        Columns: <code className="text-xs">{LOT_CSV_COLUMNS.map(([c]) => c).join(",")}</code>. Preview checks every row; Import records all rows in one go, or none if any row is wrong.
      </p>
      <div className="space-y-3">
        <Field id={`${id}-csv`} label="CSV file" hint={`Up to 100,000 lots, at most ${formatBytes(MAX_LOTS_CSV_BYTES)}.`} error={tooLarge ? `The file is ${formatBytes(file.size)}; at most ${formatBytes(MAX_LOTS_CSV_BYTES)} is accepted. Split it.` : undefined}>
          <FilePicker
            id={`${id}-csv`}
            accept=".csv,text/csv"
            file={file}
            disabled={upload.busy}
            invalid={tooLarge}
            describedBy={tooLarge ? `${id}-csv-error` : `${id}-csv-hint`}
            onFile={(f) => {
              setFile(f);
              setResult(null);
              setError(null);
              upload.reset();
            }}
          />
        </Field>
        <div className="flex flex-wrap gap-3">
          <Button variant="secondary" disabled={!file || tooLarge || upload.busy} onClick={() => void run(true)}>Preview</Button>
          <Button disabled={!file || tooLarge || upload.busy || !r?.dryRun || r.issues.length > 0} onClick={() => void run(false)}>Import</Button>
        </div>
        <UploadProgressBar state={upload.state} onCancel={upload.cancel} />
      </div>
      {error && <div className="mt-3"><ErrorNotice error={error} /></div>}
      {r && r.issues.length > 0 && (
        <div className="mt-3 space-y-2" data-testid="import-outcome">
          <Notice tone="fault" role="alert" title={`${file?.name ?? "The file"}: ${r.issues.length.toLocaleString("en")} problem(s); nothing was imported`}>
            Fix these rows and preview again.{r.issues.length > SHOWN_ISSUES && ` The first ${SHOWN_ISSUES} are listed.`}
          </Notice>
          <Table caption="Problems by row">
            <thead>
              <tr><Th>Row</Th><Th>Column</Th><Th>Problem</Th></tr>
            </thead>
            <tbody>
              {r.issues.slice(0, SHOWN_ISSUES).map((i, n) => (
                <tr key={n}><Td className="tabular-nums">{i.row}</Td><Td><code className="text-xs">{i.column || "—"}</code></Td><Td>{i.message}</Td></tr>
              ))}
            </tbody>
          </Table>
        </div>
      )}
      {r && r.issues.length === 0 && r.dryRun && <div className="mt-3" data-testid="import-outcome"><Notice tone="ok" role="status">All {r.checked.toLocaleString("en")} row(s) are valid. Nothing is recorded until you press Import.</Notice></div>}
      {r && r.issues.length === 0 && !r.dryRun && <div className="mt-3" data-testid="import-outcome"><Notice tone="ok" role="status">Imported {r.committed.toLocaleString("en")} lot(s).</Notice></div>}
    </Panel>
  );
}
