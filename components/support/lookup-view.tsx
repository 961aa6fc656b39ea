"use client";

import { useQuery } from "@tanstack/react-query";
import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { useState } from "react";
import { apiQuery } from "@/lib/api/client";
import { lookupSerial } from "@/lib/api/endpoints";
import { parseSerial } from "@/lib/serials/serial";
import { Button } from "@/components/ui/button";
import { Field, Input } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import { LookupResultView } from "./lookup-result";
import { TachConverter } from "./tach-converter";
import { RecentLookups } from "./recent-lookups";
import { DumpIdentify } from "./dump-identify";

export function LookupView() {
  const sp = useSearchParams();
  const router = useRouter();
  const pathname = usePathname();
  const serial = sp.get("serial") ?? "";
  const [text, setText] = useState(serial);
  const [formError, setFormError] = useState<string | null>(null);
  const q = useQuery({
    ...apiQuery(lookupSerial, { query: { serial } }),
    enabled: serial !== "",
    retry: (n, err) => err.code === "unavailable" && n < 2,
  });

  function search(value: string) {
    const parsed = parseSerial(value);
    if (!parsed.ok) {
      setFormError(parsed.message);
      return;
    }
    setFormError(null);
    router.replace(`${pathname}?serial=${encodeURIComponent(value.trim().toUpperCase())}`);
  }

  const err = q.error;
  return (
    <div className="space-y-5">
      <Panel>
        <form
          role="search"
          className="flex flex-wrap items-end gap-3"
          onSubmit={(e) => {
            e.preventDefault();
            search(text);
          }}
        >
          <div className="w-72">
            <Field id="serial" label="Serial number" hint="As printed on the board's label, e.g. TC1-00012345." error={formError ?? undefined}>
              <Input id="serial" name="serial" value={text} onChange={(e) => setText(e.target.value)} autoComplete="off" aria-invalid={formError ? true : undefined} aria-describedby={formError ? "serial-error" : "serial-hint"} />
            </Field>
          </div>
          <Button type="submit">Look up</Button>
        </form>
        <RecentLookups onPick={(s) => { setText(s); search(s); }} refreshKey={serial + String(q.dataUpdatedAt) + String(q.errorUpdatedAt)} />
      </Panel>
      {serial && q.isPending && <div className="h-32 animate-pulse rounded-md bg-ink-100" aria-label="Looking up the serial" />}
      {err && (
        <Notice tone={err.code === "not_found" || err.code === "bad_request" ? "warn" : "fault"} role="alert" title={err.code === "not_found" ? "Not found" : err.code === "bad_request" ? "Not a serial number" : "Lookup failed"}>
          {err.message}{" "}
          {err.code !== "not_found" && err.code !== "bad_request" && <button className="underline" onClick={() => void q.refetch()}>Retry</button>}
        </Notice>
      )}
      {q.data && <LookupResultView result={q.data} />}
      {/* Held back while a lookup loads: the converter restarts from the looked-up pump's pulses, which would throw away a reading typed meanwhile. */}
      {!(serial && q.isPending) && (
        <TachConverter key={q.data?.serial ?? "none"} pulsesPerRev={q.data?.pump.pulsesPerRev} pumpName={q.data?.pump.name} pumpRange={q.data?.slots[0]?.pump} />
      )}
      <DumpIdentify />
    </div>
  );
}
