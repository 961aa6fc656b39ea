"use client";

import dynamic from "next/dynamic";
import { useState } from "react";
import { useRouter } from "next/navigation";
import { keepPreviousData, useMutation, useQuery } from "@tanstack/react-query";
import { useForm, useWatch, type Resolver } from "react-hook-form";
import { apiCall, apiQuery, apiUploadJson } from "@/lib/api/client";
import { AppError } from "@/lib/api/errors";
import { createBuild, getBuildOptions, uploadFirmware } from "@/lib/api/endpoints";
import type { CreateBuildBody } from "@/lib/api/operations/builds";
import { UPLOAD_MAX_BYTES } from "@/lib/release/upload-limits";
import { Button } from "@/components/ui/button";
import { lazyZodResolver } from "@/components/ui/lazy-resolver";
import { Field, Input, Select, describedBy } from "@/components/ui/field";
import { ErrorNotice } from "@/components/ui/error-notice";
import { fieldsOf, showServerIssues } from "@/components/ui/server-issues";
import { Panel } from "@/components/ui/panel";
import { FilePicker } from "@/components/ui/file-picker";
import { UploadProgressBar } from "@/components/ui/upload-progress";
import { useUpload } from "@/components/ui/use-upload";
import { bankBytesFromVersionImages } from "@/lib/release/bank-fit";

// Shown once a board model's options are in; it brings the semver range checks with it.
const BankFit = dynamic(() => import("./bank-fit").then((m) => m.BankFit), { ssr: false, loading: () => <div className="h-24 animate-pulse rounded bg-ink-100" aria-label="Loading the bank size check" /> });

/** The API body without the firmware id: the file is uploaded first, on submit. Its schema loads when the form first validates. */
const bodyResolver = lazyZodResolver(() => import("@/lib/api/operations/builds").then((m) => m.createBuildBody.omit({ firmwareUploadId: true })));
type FormValues = Omit<CreateBuildBody, "firmwareUploadId">;
/** A slot left "(empty)" is not part of the bank: the body is checked, and sent, without it. */
const resolver: Resolver<FormValues, unknown, FormValues> = (values, context, options) => bodyResolver({ ...values, slots: values.slots.filter(Boolean) }, context, options);

export function NewBuildForm() {
  const router = useRouter();
  const [slotCount, setSlotCount] = useState(2);
  const [file, setFile] = useState<File | null>(null);
  const [fileError, setFileError] = useState<string>();
  const progress = useUpload();
  const form = useForm<FormValues>({ resolver, defaultValues: { version: "", revisionRange: "", slots: [] } });
  const boardModelId = useWatch({ control: form.control, name: "boardModelId" });
  const chosenSlots = useWatch({ control: form.control, name: "slots" });
  const revisionRange = useWatch({ control: form.control, name: "revisionRange" });
  // While a picked board model's options load, the previous answer keeps the board list in place:
  // were its options gone for a moment, the list would fall back to showing the first board model
  // while the form holds the picked one. Revisions and versions come only from the current answer.
  const options = useQuery({ ...apiQuery(getBuildOptions, { query: { boardModelId } }), placeholderData: keepPreviousData });
  const current = options.isPlaceholderData ? undefined : options.data;
  const create = useMutation({
    mutationFn: async (values: FormValues) => {
      if (!file) throw new AppError("validation_failed", "Pick the firmware image file.");
      const up = await progress.run(file.name, ({ signal, onProgress }) =>
        apiUploadJson(uploadFirmware, { query: { name: file.name }, raw: { data: file, contentType: "application/octet-stream" } }, { signal, onProgress }),
      );
      // Cancelled: no build is created (the stored file is only ever used by a build that names it).
      if (!up) return null;
      return apiCall(createBuild, { body: { ...values, firmwareUploadId: up.upload.id } });
    },
    onSuccess: (r) => {
      if (r) router.push(`/builds/${r.build.id}`);
    },
    onError: (err) => showServerIssues(form, err),
  });
  const { errors } = form.formState;
  // Slot versions and the revision range were chosen for the previous board model (versions are
  // for its coolers, the range is over its revisions): kept, they would be sent with the new board
  // while the lists show nothing picked, and the server would refuse them. So they start over, and
  // so do the messages about them.
  function forgetOldBoard() {
    form.setValue("slots", Array.from({ length: slotCount }, () => ""));
    form.setValue("revisionRange", "");
    form.clearErrors(["slots", "revisionRange"]);
    if (!create.isPending) create.reset();
  }
  // The versions on offer are those written for the chosen board model's coolers: none until one is chosen.
  const candidates = boardModelId ? (current?.candidates ?? []) : [];
  const chosen = (chosenSlots ?? []).filter(Boolean).map((id) => candidates.find((c) => c.id === id)).filter((c) => c !== undefined);
  const bankBytes = bankBytesFromVersionImages(chosen.map((c) => c.encodedBytes));

  return (
    <Panel>
      <form
        noValidate
        className="grid max-w-3xl gap-4"
        onSubmit={form.handleSubmit((values) => {
          if (!file) return setFileError("Choose the firmware image (.bin or .hex).");
          if (file.size > UPLOAD_MAX_BYTES.firmware) return setFileError(`The firmware is larger than ${UPLOAD_MAX_BYTES.firmware} bytes.`);
          setFileError(undefined);
          create.mutate({ ...values, slots: values.slots.filter(Boolean) });
        })}
      >
        <Field id="boardModelId" label="Board model" error={errors.boardModelId?.message}>
          <Select {...describedBy("boardModelId", errors.boardModelId?.message)} {...form.register("boardModelId", { onChange: forgetOldBoard })} defaultValue="">
            <option value="" disabled>Pick a board model…</option>
            {options.data?.boardModels.map((b) => (
              <option key={b.id} value={b.id}>{b.name}</option>
            ))}
          </Select>
        </Field>
        {current && boardModelId && current.revisions.length === 0 && <p className="text-xs text-ink-600">This board model has no revisions yet.</p>}
        <div className="grid gap-4 sm:grid-cols-2">
          <Field id="version" label="Build version" hint="Semantic version, e.g. 1.5.0" error={errors.version?.message}>
            <Input {...describedBy("version", errors.version?.message)} {...form.register("version")} autoComplete="off" />
          </Field>
          <Field id="revisionRange" label="Board revisions" hint="A semver range, e.g. >=1.1.0 <3.0.0" error={errors.revisionRange?.message}>
            <Input {...describedBy("revisionRange", errors.revisionRange?.message)} {...form.register("revisionRange")} autoComplete="off" />
          </Field>
        </div>
        <fieldset className="space-y-2">
          <legend className="text-sm font-medium text-ink-800">Slots (published profile versions)</legend>
          {!boardModelId ? (
            <p className="text-xs text-ink-600">Pick a board model to see its profile versions.</p>
          ) : (
            current && candidates.length === 0 && <p className="text-xs text-ink-600">No profile version is published for this board model&apos;s coolers yet; publish one from Profiles first.</p>
          )}
          {Array.from({ length: slotCount }, (_, i) => (
            <Field key={i} id={`slot-${i}`} label={`Slot ${i + 1}`} error={i === 0 ? (errors.slots?.root?.message ?? errors.slots?.message ?? errors.slots?.[0]?.message) : errors.slots?.[i]?.message}>
              <Select {...describedBy(`slot-${i}`)} {...form.register(`slots.${i}`)} defaultValue="">
                <option value="">{i === 0 ? "Pick a profile version…" : "(empty)"}</option>
                {candidates.map((c) => (
                  <option key={c.id} value={c.id}>
                    {c.coolerModel} · {c.profileName} {c.version} ({c.encodedBytes} B, boards {c.boardRange})
                  </option>
                ))}
              </Select>
            </Field>
          ))}
          <div className="flex gap-2">
            <Button variant="secondary" disabled={slotCount >= 16} onClick={() => setSlotCount((n) => n + 1)}>Add a slot</Button>
            <Button
              variant="secondary"
              disabled={slotCount <= 1}
              onClick={() => {
                form.setValue("slots", form.getValues("slots").slice(0, slotCount - 1));
                setSlotCount((n) => n - 1);
              }}
            >
              Remove the last slot
            </Button>
          </div>
        </fieldset>
        {current && boardModelId && current.revisions.length > 0 && (
          <BankFit bankBytes={bankBytes} slots={chosen.length} revisionRange={revisionRange} revisions={current.revisions} />
        )}
        <Field id="firmware" label="Firmware image" hint={`.bin (raw bytes) or Intel HEX .hex, at most ${UPLOAD_MAX_BYTES.firmware / 1024 / 1024} MiB`} error={fileError}>
          <FilePicker
            id="firmware"
            accept=".bin,.hex,application/octet-stream"
            file={file}
            disabled={create.isPending}
            invalid={Boolean(fileError)}
            describedBy={fileError ? "firmware-error" : "firmware-hint"}
            onFile={(f) => {
              setFile(f);
              setFileError(undefined);
              progress.reset();
            }}
          />
        </Field>
        <UploadProgressBar state={progress.state} onCancel={progress.cancel} cancelledNote="Cancelled; no build was created." />
        <ErrorNotice error={create.error} besideFields={fieldsOf(form)} />
        <div>
          <Button type="submit" disabled={create.isPending}>{create.isPending ? "Creating…" : "Create build"}</Button>
        </div>
      </form>
    </Panel>
  );
}
