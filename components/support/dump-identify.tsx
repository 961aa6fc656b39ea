"use client";

import { useMutation } from "@tanstack/react-query";
import { useId, useState } from "react";
import { apiFetch } from "@/lib/api/client";
import type { DumpIdentifyResult } from "@/lib/api/operations/support";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import { Table, Td, Th } from "@/components/ui/table";
import { ErrorNotice } from "@/components/ui/error-notice";

const MATCH_LABEL = { exact: "Known version", hash_only: "Known content, other version", unknown: "Unknown" } as const;

export function DumpIdentify() {
  const id = useId();
  const [file, setFile] = useState<File | null>(null);
  const identify = useMutation({
    mutationFn: (f: File) => {
      const fd = new FormData();
      fd.set("file", f);
      return apiFetch<DumpIdentifyResult>("/api/v1/dumps/identify", { method: "POST", body: fd });
    },
  });
  const r = identify.data;
  return (
    <Panel title="Identify a memory dump">
      <form
        className="flex flex-wrap items-end gap-3"
        onSubmit={(e) => {
          e.preventDefault();
          if (file) identify.mutate(file);
        }}
      >
        <div>
          <label htmlFor={`${id}-file`} className="block text-sm font-medium text-ink-800">Dump file (.bin or .hex)</label>
          <input
            id={`${id}-file`}
            type="file"
            accept=".bin,.hex,.ihex,application/octet-stream,text/plain"
            className="mt-1 block text-sm"
            onChange={(e) => setFile(e.target.files?.[0] ?? null)}
            aria-describedby={`${id}-hint`}
          />
          <p id={`${id}-hint`} className="mt-1 text-xs text-ink-600">Read back from a returned board; at most 256 KiB.</p>
        </div>
        <Button type="submit" disabled={!file || identify.isPending}>{identify.isPending ? "Reading…" : "Identify"}</Button>
      </form>
      {identify.error && <div className="mt-3"><ErrorNotice error={identify.error} /></div>}
      {r && (
        <div className="mt-4 space-y-3" data-testid="dump-result">
          {r.status === "ok" && <Notice tone="ok" role="status" title="Dump is intact">CRC-32 {r.crc?.stored} matches; {r.slots.length} slot(s) read.</Notice>}
          {r.status === "corrupt" && (
            <Notice tone="fault" role="alert" title="Dump is corrupt">
              {r.errors[0]?.message ?? r.hex?.errors[0]?.message ?? "The image is damaged."} Slots that could still be read are listed below.
            </Notice>
          )}
          {r.status === "unreadable" && (
            <Notice tone="fault" role="alert" title="Not a readable profile bank">{r.errors[0]?.message ?? "The file holds no profile bank."}</Notice>
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
                  <Th>Identified as</Th>
                </tr>
              </thead>
              <tbody>
                {r.slots.map((s) => (
                  <tr key={s.slotIndex}>
                    <Td>{s.slotIndex}</Td>
                    <Td className="tabular-nums">{s.version}</Td>
                    <Td><code className="text-xs">{s.contentHashPrefix}</code></Td>
                    <Td>
                      <Badge tone={s.match === "exact" ? "ok" : s.match === "hash_only" ? "warn" : "neutral"}>{MATCH_LABEL[s.match]}</Badge>{" "}
                      {s.profileName && <span>{s.coolerName} · {s.profileName} {s.knownVersion ?? s.version}</span>}
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
