"use client";

import { useRef, useState } from "react";
import { AppError } from "@/lib/api/errors";
import { MAX_PROFILE_BYTES } from "@/lib/api/operations/profile-schemas";
import { ErrorNotice } from "@/components/ui/error-notice";
import { buttonClass } from "@/components/ui/button";

/** Uploads a .json profile; the server validates it and replaces the draft, then the editor shows it. */
export function ImportButton({ profileId, onImported }: { profileId: string; onImported: (text: string) => void }) {
  const input = useRef<HTMLInputElement>(null);
  const [error, setError] = useState<AppError | null>(null);
  const [busy, setBusy] = useState(false);
  async function upload(file: File) {
    setError(null);
    if (file.size > MAX_PROFILE_BYTES) {
      setError(new AppError("payload_too_large", `The file is ${Math.ceil(file.size / 1024)} KiB; at most 256 KiB is accepted.`));
      return;
    }
    setBusy(true);
    try {
      const text = await file.text();
      const res = await fetch(`/api/v1/profiles/${profileId}/import`, { method: "POST", headers: { "content-type": "application/json" }, body: text });
      const body = (await res.json().catch(() => null)) as { error?: { message: string; issues?: { path: string; message: string }[] } } | null;
      if (!res.ok) {
        setError(new AppError("validation_failed", body?.error?.message ?? `The server answered ${res.status}.`, { issues: body?.error?.issues }));
        return;
      }
      onImported(`${JSON.stringify(JSON.parse(text), null, 2)}\n`);
    } catch {
      setError(new AppError("unavailable", "Could not read or send the file."));
    } finally {
      setBusy(false);
      if (input.current) input.current.value = "";
    }
  }
  return (
    <div className="space-y-2">
      <label className={buttonClass("secondary", busy ? "opacity-60" : "cursor-pointer")}>
        Import .json
        <input ref={input} type="file" accept=".json,application/json" className="sr-only" disabled={busy} onChange={(e) => { const f = e.target.files?.[0]; if (f) void upload(f); }} />
      </label>
      <ErrorNotice error={error} />
    </div>
  );
}
