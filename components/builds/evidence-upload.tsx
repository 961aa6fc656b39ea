"use client";

import { apiUploadJson } from "@/lib/api/client";
import { uploadEvidence } from "@/lib/api/endpoints";
import { UPLOAD_LABELS } from "@/lib/release/upload-limits";
import { Field } from "@/components/ui/field";
import { FilePicker } from "@/components/ui/file-picker";
import { UploadProgressBar } from "@/components/ui/upload-progress";
import { useUpload } from "@/components/ui/use-upload";
import { useBuildMutation } from "./use-build";

/** One kind of lab evidence: chosen, it is sent at once with its progress and Cancel; a refusal shows its bad rows here. */
export function EvidenceUpload({ buildId, kind }: { buildId: string; kind: "lab_report" | "measurements" }) {
  const progress = useUpload();
  const upload = useBuildMutation(buildId, (file: File) =>
    progress.run(file.name, ({ signal, onProgress }) =>
      apiUploadJson(uploadEvidence, { params: { id: buildId }, query: { kind, name: file.name }, raw: { data: file, contentType: "application/octet-stream" } }, { signal, onProgress }),
    ),
  );
  const failed = upload.error;
  const attached = upload.isSuccess && upload.data ? upload.variables.name : null;
  const id = `evidence-${kind}`;
  return (
    <Field id={id} label={UPLOAD_LABELS[kind]} hint={kind === "measurements" ? "Header: liquid_temp_c,pump_rpm,fan_rpm,sound_dba and optionally background_dba (per row, or once on the first row)" : "The signed lab report."}>
      <FilePicker
        id={id}
        accept={kind === "lab_report" ? ".pdf,application/pdf" : ".csv,text/csv"}
        file={null}
        disabled={progress.busy}
        invalid={Boolean(failed)}
        describedBy={failed ? `${id}-refusal` : `${id}-hint`}
        onFile={(file) => {
          if (file) upload.mutate(file);
        }}
      />
      <UploadProgressBar state={progress.state} onCancel={progress.cancel} cancelledNote="Cancelled; nothing was attached." />
      {failed && (
        <div id={`${id}-refusal`} role="alert" className="text-xs text-signal-fault">
          <p className="font-medium">{failed.message}</p>
          {failed.issues && failed.issues.length > 0 && <ul className="list-disc pl-5">{failed.issues.map((i, n) => <li key={n}>{i.message}</li>)}</ul>}
        </div>
      )}
      {attached && <p role="status" className="text-xs text-signal-ok">Attached {attached}.</p>}
    </Field>
  );
}
