"use client";

import { useRef, useState } from "react";
import type { AppError } from "@/lib/api/errors";
import { MAX_PROFILE_BYTES } from "@/lib/api/operations/profile-schemas";
import { Notice } from "@/components/ui/notice";
import { buttonClass } from "@/components/ui/button";

/** Uploads a .json profile; the server validates it and replaces the draft, then the editor shows it. */
export function ImportButton({ profileId, onImported }: { profileId: string; onImported: (text: string, draftRevision: number) => void }) {
  const input = useRef<HTMLInputElement>(null);
  const [error, setError] = useState<AppError | null>(null);
  const [busy, setBusy] = useState(false);
  async function upload(file: File) {
    setError(null);
    if (file.size > MAX_PROFILE_BYTES) {
      setError({ message: `The file is ${Math.ceil(file.size / 1024)} KiB; at most 256 KiB is accepted.` } as AppError);
      return;
    }
    setBusy(true);
    try {
      const text = await file.text();
      const res = await fetch(`/api/v1/profiles/${profileId}/import`, { method: "POST", headers: { "content-type": "application/json" }, body: text });
      const body = (await res.json().catch(() => null)) as { draftRevision?: number; error?: { message: string; issues?: { path: string; message: string }[] } } | null;
      if (!res.ok) {
        setError({ message: body?.error?.message ?? `The server answered ${res.status}.`, issues: body?.error?.issues } as AppError);
        return;
      }
      // The server keeps the file as written; the editor shows the same text.
      onImported(text, body?.draftRevision ?? 0);
    } catch {
      setError({ message: "Could not read or send the file." } as AppError);
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
      {error && (
        <Notice tone="fault" role="alert" title={error.message}>
          {error.issues && <ul className="list-disc pl-5">{error.issues.map((i, n) => <li key={n}><code className="text-xs">{i.path}</code> {i.message}</li>)}</ul>}
        </Notice>
      )}
    </div>
  );
}
