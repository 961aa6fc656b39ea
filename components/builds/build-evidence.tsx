"use client";

import { useState } from "react";
import { apiFetch } from "@/lib/api/client";
import type { BuildDetail, UploadView, WaiverBody } from "@/lib/api/operations/builds";
import { can, type Role } from "@/lib/auth/roles";
import { UPLOAD_LABELS } from "@/lib/release/upload-check";
import { Button } from "@/components/ui/button";
import { Field, Textarea } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import { EmptyRow, Table, Td, Th } from "@/components/ui/table";
import { ErrorNotice } from "@/components/ui/error-notice";
import { SoundPlot } from "./sound-plot";
import { useBuildMutation } from "./use-build";

const EVIDENCE_STAGES = ["draft", "review", "validation"];

function UploadRow({ label, upload }: { label: string; upload: UploadView | null }) {
  return (
    <tr>
      <Td className="font-medium">{label}</Td>
      {upload ? (
        <>
          <Td>
            <a href={`/api/v1/uploads/${upload.id}`} download>{upload.originalName}</a>
            <span className="block text-xs text-ink-600">{upload.sizeBytes} B · {upload.contentType}</span>
          </Td>
          <Td><code className="break-all text-xs">{upload.sha256}</code></Td>
        </>
      ) : (
        <Td className="text-ink-500">Not attached</Td>
      )}
    </tr>
  );
}

/** Firmware, lab report and measurements with their SHA-256; the lab evidence form; the sound comparison. */
export function BuildEvidence({ detail, role }: { detail: BuildDetail; role: Role }) {
  const { build, uploads, comparison } = detail;
  const [waiver, setWaiver] = useState("");
  const upload = useBuildMutation(build.id, ({ kind, file }: { kind: "lab_report" | "measurements"; file: File }) =>
    apiFetch(`/api/v1/builds/${build.id}/evidence?kind=${kind}&name=${encodeURIComponent(file.name)}`, { method: "POST", body: file, headers: { "content-type": "application/octet-stream" } }),
  );
  const waive = useBuildMutation(build.id, (body: WaiverBody) => apiFetch(`/api/v1/builds/${build.id}/waiver`, { method: "POST", json: body }));
  const mayAttach = can(role, "build:promote") && EVIDENCE_STAGES.includes(build.stage);
  const outside = comparison.state === "ok" ? comparison.rows.filter((r) => !r.withinTolerance).length : 0;

  return (
    <>
      <Panel title="Files">
        <Table caption="Files of this build">
          <thead>
            <tr>
              <Th>File</Th>
              <Th>Name</Th>
              <Th>SHA-256</Th>
            </tr>
          </thead>
          <tbody>
            <UploadRow label="Firmware image" upload={uploads.firmware} />
            <UploadRow label="Lab report" upload={uploads.labReport} />
            <UploadRow label="Measurements" upload={uploads.measurements} />
          </tbody>
        </Table>
        {mayAttach && (
          <div className="mt-3 grid gap-3 border-t border-ink-200 pt-3 sm:grid-cols-2">
            {(["lab_report", "measurements"] as const).map((kind) => (
              <Field key={kind} id={`evidence-${kind}`} label={UPLOAD_LABELS[kind]} hint={kind === "measurements" ? "Header: liquid_temp_c,pump_rpm,fan_rpm,sound_dba" : "The signed lab report."}>
                <input
                  id={`evidence-${kind}`}
                  type="file"
                  accept={kind === "lab_report" ? ".pdf,application/pdf" : ".csv,text/csv"}
                  aria-describedby={`evidence-${kind}-hint`}
                  className="block text-sm"
                  disabled={upload.isPending}
                  onChange={(e) => {
                    const file = e.target.files?.[0];
                    if (file) upload.mutate({ kind, file });
                    e.target.value = "";
                  }}
                />
              </Field>
            ))}
          </div>
        )}
        <div className="mt-2">
          <ErrorNotice error={upload.error} />
          {upload.isSuccess && <Notice tone="ok" role="status">File attached.</Notice>}
        </div>
      </Panel>

      <Panel title="Measured against estimated sound">
        {comparison.state === "none" && <p className="text-sm text-ink-600">Attach the measurement CSV to compare the lab&apos;s sound levels with the estimate.</p>}
        {comparison.state === "invalid" && (
          <Notice tone="fault" title="The measurement CSV has problems">
            <ul className="list-disc pl-5">{comparison.errors.map((e, i) => <li key={i}>{e}</li>)}</ul>
          </Notice>
        )}
        {comparison.state === "ok" && (
          <div className="space-y-3">
            <p className="text-sm text-ink-700">
              Estimate for the {comparison.coolerModel} (first slot&apos;s cooler) at the measured pump and fan speeds, 1 m. Tolerance ±{comparison.toleranceDb} dB:{" "}
              {outside === 0 ? <strong className="text-signal-ok">every point within it.</strong> : <strong className="text-signal-fault">{outside} of {comparison.rows.length} points outside it.</strong>}
            </p>
            <SoundPlot rows={comparison.rows} />
            <Table caption="Measured and estimated sound levels">
              <thead>
                <tr>
                  <Th>Liquid °C</Th>
                  <Th>Pump RPM</Th>
                  <Th>Fan RPM</Th>
                  <Th>Measured dB(A)</Th>
                  <Th>Estimated dB(A)</Th>
                  <Th>Difference dB</Th>
                </tr>
              </thead>
              <tbody>
                {comparison.rows.length === 0 && <EmptyRow colSpan={6}>No rows.</EmptyRow>}
                {comparison.rows.map((r, i) => (
                  <tr key={i}>
                    <Td className="tabular-nums">{r.liquidTempC}</Td>
                    <Td className="tabular-nums">{r.pumpRpm}</Td>
                    <Td className="tabular-nums">{r.fanRpm}</Td>
                    <Td className="tabular-nums">{r.soundDbA.toFixed(1)}</Td>
                    <Td className="tabular-nums">{Number.isFinite(r.estimatedDbA) ? r.estimatedDbA.toFixed(1) : "—"}</Td>
                    <Td className={`tabular-nums ${r.withinTolerance ? "" : "font-semibold text-signal-fault"}`}>{Number.isFinite(r.deltaDb) ? (r.deltaDb > 0 ? "+" : "") + r.deltaDb.toFixed(1) : "—"}</Td>
                  </tr>
                ))}
              </tbody>
            </Table>
          </div>
        )}
        {build.waiverReason && <div className="mt-3"><Notice tone="warn" title="Waiver recorded">{build.waiverReason}</Notice></div>}
        {build.stage === "validation" && can(role, "build:promote") && !build.waiverReason && outside > 0 && (
          <form
            className="mt-3 space-y-2 border-t border-ink-200 pt-3"
            onSubmit={(e) => {
              e.preventDefault();
              waive.mutate({ reason: waiver });
            }}
          >
            <Field id="waiverReason" label="Waiver reason" hint="Why the build may go to the pilot run although the sound levels differ from the estimate.">
              <Textarea id="waiverReason" rows={2} value={waiver} onChange={(e) => setWaiver(e.target.value)} aria-describedby="waiverReason-hint" />
            </Field>
            <Button type="submit" variant="secondary" disabled={waive.isPending}>Record waiver</Button>
            <ErrorNotice error={waive.error} />
          </form>
        )}
      </Panel>
    </>
  );
}
