"use client";

import { useMutation } from "@tanstack/react-query";
import { useId, useState } from "react";
import { apiUploadJson } from "@/lib/api/client";
import { identifyDump } from "@/lib/api/endpoints";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/ui/field";
import { FilePicker } from "@/components/ui/file-picker";
import { UploadProgressBar } from "@/components/ui/upload-progress";
import { useUpload } from "@/components/ui/use-upload";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import { Table, Td, Th } from "@/components/ui/table";
import { ErrorNotice } from "@/components/ui/error-notice";

const MATCH_LABEL = { exact: "Exact registry version", altered: "Altered", unknown: "Unknown to the registry", undecodable: "Cannot be read" } as const;
const MATCH_TONE = { exact: "ok", altered: "fault", unknown: "neutral", undecodable: "fault" } as const;
const SIGNATURE_TONE = { valid: "ok", invalid: "fault", unverified: "warn", unsigned: "neutral" } as const;

export function DumpIdentify() {
  const id = useId();
  const [file, setFile] = useState<File | null>(null);
  const [sig, setSig] = useState<File | null>(null);
  const progress = useUpload();
  const identify = useMutation({
    mutationFn: (f: { dump: File; sig: File | null }) => {
      const fd = new FormData();
      fd.set("file", f.dump);
      if (f.sig) fd.set("signature", f.sig);
      return progress.run(f.dump.name, ({ signal, onProgress }) => apiUploadJson(identifyDump, { raw: { data: fd } }, { signal, onProgress }));
    },
  });
  // A new file (or none) for either field: the last answer and progress no longer apply.
  const chosen = (set: (f: File | null) => void) => (f: File | null) => {
    set(f);
    identify.reset();
    progress.reset();
  };
  const r = identify.data;
  return (
    <Panel title="Identify a memory dump">
      <form
        className="space-y-3"
        onSubmit={(e) => {
          e.preventDefault();
          if (file) identify.mutate({ dump: file, sig });
        }}
      >
        <Field id={`${id}-file`} label="Dump file (.bin or .hex)" hint="Read back from a returned board; at most 256 KiB.">
          <FilePicker
            id={`${id}-file`}
            accept=".bin,.hex,.ihex,application/octet-stream,text/plain"
            file={file}
            disabled={progress.busy}
            describedBy={`${id}-file-hint`}
            onFile={chosen(setFile)}
          />
        </Field>
        <Field id={`${id}-sig`} label="Signature (.sig, optional)" hint="Without one, a signature stored after the CRC or the matching build's is checked.">
          <FilePicker
            id={`${id}-sig`}
            accept=".sig,application/octet-stream"
            file={sig}
            disabled={progress.busy}
            describedBy={`${id}-sig-hint`}
            onFile={chosen(setSig)}
          />
        </Field>
        <Button type="submit" disabled={!file || progress.busy}>{progress.busy ? "Reading…" : "Identify"}</Button>
        <UploadProgressBar state={progress.state} onCancel={progress.cancel} cancelledNote="Cancelled; nothing was identified." />
      </form>
      {identify.error && <div className="mt-3"><ErrorNotice error={identify.error} /></div>}
      {r && (
        <div className="mt-4 space-y-3" data-testid="dump-result">
          {r.status === "ok" && r.faults.length === 0 && <Notice tone="ok" role="status" title="Dump is intact">CRC-32 {r.crc?.stored} matches; {r.slots.length} slot(s) read, every one checked by content.</Notice>}
          {r.status === "corrupt" && (
            <Notice tone="fault" role="alert" title="Dump is corrupt">
              {r.errors[0]?.message ?? r.hex?.errors[0]?.message ?? "The image is damaged."} Slots that could still be read are listed below.
            </Notice>
          )}
          {r.status === "unreadable" && (
            <Notice tone="fault" role="alert" title="Not a readable profile bank">{r.errors[0]?.message ?? "The file holds no profile bank."}</Notice>
          )}
          {r.faults.length > 0 && (
            <Notice tone="fault" role="alert" title={`${r.faults.length} fault(s) in what the board holds`}>
              <ul className="list-disc pl-5" data-testid="dump-faults">
                {r.faults.map((f) => <li key={f}>{f}</li>)}
              </ul>
            </Notice>
          )}
          {r.build ? (
            <Notice tone="ok" role="status" title={`This is the bank of build ${r.build.version}`}>
              The whole image equals, byte for byte (SHA-256), the bank of build {r.build.version}{r.build.boardModelName ? ` for ${r.build.boardModelName}` : ""}, stage {r.build.stage}.
            </Notice>
          ) : r.imageSha256 ? (
            <p className="text-sm text-ink-700">No build in the registry has exactly this bank (SHA-256 <code className="text-xs">{r.imageSha256.slice(0, 16)}…</code>).</p>
          ) : null}
          {r.signature && (
            <p className="text-sm" data-testid="dump-signature">
              <Badge tone={SIGNATURE_TONE[r.signature.status]}>{r.signature.status === "unsigned" ? "Unsigned" : `Signed by key ${r.signature.keyId ?? "?"}: ${r.signature.status === "unverified" ? "not checked" : r.signature.status}`}</Badge>{" "}
              {r.signature.message}
            </p>
          )}
          <p className="text-xs text-ink-600">
            {r.fileName ?? "Upload"}: {r.format === "hex" ? "Intel HEX" : "binary"}, {r.sizeBytes} bytes
            {r.crc && <>; CRC-32 stored {r.crc.stored}, computed {r.crc.computed}</>}
          </p>
          {r.slots.length > 0 && (
            <Table caption="Slots in the dump">
              <thead>
                <tr>
                  <Th>Slot</Th>
                  <Th>Stored version</Th>
                  <Th>Content hash</Th>
                  <Th>Identified by content</Th>
                  <Th>Differences and findings</Th>
                </tr>
              </thead>
              <tbody>
                {r.slots.map((s) => (
                  <tr key={s.slotIndex}>
                    <Td className="tabular-nums">{s.slotIndex + 1}</Td>
                    <Td className="tabular-nums">{s.version ?? "—"}</Td>
                    <Td>{s.contentHashPrefix ? <code className="text-xs">{s.contentHashPrefix}</code> : "—"}</Td>
                    <Td>
                      <Badge tone={MATCH_TONE[s.match]}>{MATCH_LABEL[s.match]}</Badge>{" "}
                      {s.profileName && <span>{s.coolerName} · {s.profileName} v{s.knownVersion}</span>}
                    </Td>
                    <Td>
                      {s.reason && <p>{s.reason}</p>}
                      {s.differences.length > 0 && (
                        <ul className="list-disc pl-5">
                          {s.differences.map((d) => <li key={d}>{d}</li>)}
                        </ul>
                      )}
                      {s.findings.length > 0 && (
                        <ul className="mt-1 space-y-0.5">
                          {s.findings.map((f) => (
                            <li key={`${f.code}${f.message}`}>
                              <Badge tone={f.severity === "error" ? "fault" : "warn"}>{f.severity === "error" ? "Fault" : "Warning"}</Badge> {f.message}
                            </li>
                          ))}
                        </ul>
                      )}
                      {s.match === "exact" && s.findings.length === 0 && <span className="text-ink-600">Bytes equal the registry&apos;s encoding.</span>}
                    </Td>
                  </tr>
                ))}
              </tbody>
            </Table>
          )}
        </div>
      )}
    </Panel>
  );
}
