"use client";

import dynamic from "next/dynamic";
import { useState } from "react";
import { apiCall } from "@/lib/api/client";
import { recordWaiver } from "@/lib/api/endpoints";
import type { BuildDetail, UploadView, WaiverBody } from "@/lib/api/operations/builds";
import { can, type Role } from "@/lib/auth/roles";
import { takesEvidence } from "@/lib/release/stages";
import { Button } from "@/components/ui/button";
import { Field, Textarea } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import { EmptyRow, Table, Td, Th } from "@/components/ui/table";
import { ErrorNotice } from "@/components/ui/error-notice";
import { EvidenceUpload } from "./evidence-upload";
import { useBuildMutation } from "./use-build";

// recharts is large: the sound plot loads only when a build with measurements is on screen.
const SoundPlot = dynamic(() => import("./sound-plot"), {
  ssr: false,
  loading: () => <div className="h-64 animate-pulse rounded bg-ink-100" aria-label="Loading the sound plot" />,
});

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
  const waive = useBuildMutation(build.id, (body: WaiverBody) => apiCall(recordWaiver, { params: { id: build.id }, body }));
  const mayAttach = can(role, "build:promote") && takesEvidence(build.stage);
  const outside = comparison.state === "ok" ? comparison.rows.filter((r) => !r.withinTolerance).length : 0;
  const tooClose = comparison.state === "ok" ? comparison.rows.filter((r) => r.status === "too_close_to_background").length : 0;
  const compared = comparison.state === "ok" ? comparison.rows.length - tooClose : 0;

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
              <EvidenceUpload key={kind} buildId={build.id} kind={kind} />
            ))}
          </div>
        )}
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
              {compared === 0 ? (
                <strong className="text-signal-fault">no point is far enough above the room&apos;s background to compare; measure in a quieter room or record a waiver.</strong>
              ) : outside === 0 ? (
                <strong className="text-signal-ok">no compared point is louder than the estimate by more than that.</strong>
              ) : (
                <strong className="text-signal-fault">{outside} of {compared} compared points louder than the estimate by more than that.</strong>
              )}
              {tooClose > 0 && ` ${tooClose} point${tooClose === 1 ? " is" : "s are"} too close to background to compare.`}
            </p>
            <SoundPlot rows={comparison.rows} />
            <Table caption="Measured and estimated sound levels">
              <thead>
                <tr>
                  <Th>Liquid °C</Th>
                  <Th>Pump RPM</Th>
                  <Th>Fan RPM</Th>
                  <Th>Measured dB(A)</Th>
                  <Th>Background dB(A)</Th>
                  <Th>Corrected dB(A)</Th>
                  <Th>Estimated dB(A)</Th>
                  <Th>Difference dB</Th>
                </tr>
              </thead>
              <tbody>
                {comparison.rows.length === 0 && <EmptyRow colSpan={8}>No rows.</EmptyRow>}
                {comparison.rows.map((r, i) => (
                  <tr key={i}>
                    <Td className="tabular-nums">{r.liquidTempC}</Td>
                    <Td className="tabular-nums">{r.pumpRpm}</Td>
                    <Td className="tabular-nums">{r.fanRpm}</Td>
                    <Td className="tabular-nums">{r.soundDbA.toFixed(1)}</Td>
                    <Td className="tabular-nums">{r.backgroundDbA === null ? "—" : r.backgroundDbA.toFixed(1)}</Td>
                    <Td className="tabular-nums">
                      {r.correctedDbA === null ? "—" : r.correctedDbA.toFixed(1)}
                      {r.correctionDb !== null && r.correctionDb > 0 && <span className="block text-xs text-ink-600">K1 {r.correctionDb.toFixed(2)} dB</span>}
                    </Td>
                    <Td className="tabular-nums">{Number.isFinite(r.estimatedDbA) ? r.estimatedDbA.toFixed(1) : "—"}</Td>
                    <Td className={`tabular-nums ${r.status === "above_tolerance" ? "font-semibold text-signal-fault" : ""}`}>
                      {r.status === "too_close_to_background" ? (
                        <span className="text-ink-600">Not comparable — too close to background</span>
                      ) : r.deltaDb !== null && Number.isFinite(r.deltaDb) ? (
                        (r.deltaDb > 0 ? "+" : "") + r.deltaDb.toFixed(1)
                      ) : (
                        "—"
                      )}
                    </Td>
                  </tr>
                ))}
              </tbody>
            </Table>
            <p className="text-xs text-ink-600">
              Background correction per ISO 3744:2010 §8.2.3: none at 15 dB or more above the room, K1 = −10·log10(1 − 10^(−0.1·ΔL)) from 6 to 15 dB, not comparable below 6 dB. A point fails only when the cooler is louder than estimated by more than the tolerance.
            </p>
          </div>
        )}
        {build.waiverReason && <div className="mt-3"><Notice tone="warn" title="Waiver recorded">{build.waiverReason}</Notice></div>}
        {build.stage === "validation" && can(role, "build:promote") && !build.waiverReason && (outside > 0 || (comparison.state === "ok" && compared === 0)) && (
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
