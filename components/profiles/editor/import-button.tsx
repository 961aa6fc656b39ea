"use client";

import { useRef, useState } from "react";
import { apiUploadJson } from "@/lib/api/client";
import { AppError } from "@/lib/api/errors";
import { importDraft } from "@/lib/api/endpoints";
import { MAX_PROFILE_BYTES } from "@/lib/api/limits";
import { ErrorNotice } from "@/components/ui/error-notice";
import { buttonClass } from "@/components/ui/button";
import { UploadProgressBar } from "@/components/ui/upload-progress";
import { useUpload } from "@/components/ui/use-upload";

/** Uploads a .json profile; the server validates it and replaces the draft, then the editor shows it. */
export function ImportButton({ profileId, onImported }: { profileId: string; onImported: (text: string, draftRevision: number) => void }) {
  const input = useRef<HTMLInputElement>(null);
  const [error, setError] = useState<AppError | null>(null);
  const progress = useUpload();
  const busy = progress.busy;
  async function upload(file: File) {
    setError(null);
    if (file.size > MAX_PROFILE_BYTES) {
      setError(new AppError("payload_too_large", `The file is ${Math.ceil(file.size / 1024)} KiB; at most 256 KiB is accepted.`));
      return;
    }
    try {
      const text = await file.text();
      const saved = await progress.run(file.name, ({ signal, onProgress }) =>
        apiUploadJson(importDraft, { params: { id: profileId }, raw: { data: text, contentType: "application/json" } }, { signal, onProgress }),
      );
      // The server keeps the file as written; the editor shows the same text.
      if (saved) onImported(text, saved.draftRevision);
    } catch (err) {
      setError(err instanceof AppError ? err : new AppError("bad_request", "Could not read or send the file."));
    } finally {
      if (input.current) input.current.value = "";
    }
  }
  return (
    <div className="space-y-2">
      <label className={buttonClass("secondary", busy ? "opacity-60" : "cursor-pointer")}>
        Import .json
        <input ref={input} type="file" accept=".json,application/json" className="sr-only" disabled={busy} onChange={(e) => { const f = e.target.files?.[0]; if (f) void upload(f); }} />
      </label>
      <UploadProgressBar state={progress.state} onCancel={progress.cancel} cancelledNote="Cancelled; the draft was not replaced." />
      <ErrorNotice error={error} />
    </div>
  );
}
