"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { apiCall, operationKey } from "@/lib/api/client";
import { createBoardModel, createBoardRevision, getBoardRevision, listBoardModels, updateBoardModel, updateBoardRevision } from "@/lib/api/endpoints";
import type { BoardModelBody, BoardModelView, BoardRevisionBody, BoardRevisionView } from "@/lib/api/operations/registry-schemas";
import { Button } from "@/components/ui/button";
import { lazyZodResolver } from "@/components/ui/lazy-resolver";
import { Field, Input, Select, Textarea, describedBy } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";
import { NumberField } from "./number-field";
import { ErrorNotice } from "@/components/ui/error-notice";
import { fieldsOf, showServerIssues } from "@/components/ui/server-issues";

/** Client-side checks with the API body's own schema, loaded when the form first validates. */
const boardModelBodyResolver = lazyZodResolver(() => import("@/lib/api/operations/registry-schemas").then((m) => m.boardModelBody));
/** Client-side checks with the API body's own schema, loaded when the form first validates. */
const boardRevisionBodyResolver = lazyZodResolver(() => import("@/lib/api/operations/registry-schemas").then((m) => m.boardRevisionBody));

/** Adds a board model, or edits `editing` (same schema as the API body). */
export function BoardModelForm({ editing, onDone }: { editing?: BoardModelView; onDone?: () => void }) {
  const qc = useQueryClient();
  const form = useForm<BoardModelBody>({
    resolver: boardModelBodyResolver,
    defaultValues: editing ? { name: editing.name, serialPrefix: editing.serialPrefix, description: editing.description } : { description: "" },
  });
  const create = useMutation({
    mutationFn: (v: BoardModelBody) =>
      editing ? apiCall(updateBoardModel, { params: { id: editing.id }, body: v }) : apiCall(createBoardModel, { body: v }),
    onSuccess: () => {
      if (!editing) form.reset({ name: "", serialPrefix: "", description: "" });
      void qc.invalidateQueries({ queryKey: operationKey(listBoardModels) });
      onDone?.();
    },
    onError: (err) => showServerIssues(form, err),
  });
  const { errors } = form.formState;
  const p = editing ? `bme-${editing.id.slice(0, 8)}` : "bm";
  return (
    <Panel title={editing ? `Edit ${editing.name}` : "Add a board model"}>
      <form onSubmit={(e) => void form.handleSubmit((v) => create.mutate(v))(e)} className="space-y-3" noValidate>
        {create.error && <ErrorNotice error={create.error} besideFields={fieldsOf(form)} />}
        <Field id={`${p}-name`} label="Name" error={errors.name?.message}>
          <Input {...describedBy(`${p}-name`, errors.name?.message)} {...form.register("name")} />
        </Field>
        <Field id={`${p}-prefix`} label="Serial prefix" hint="2–8 capital letters or digits." error={errors.serialPrefix?.message}>
          <Input {...describedBy(`${p}-prefix`, errors.serialPrefix?.message)} {...form.register("serialPrefix")} />
        </Field>
        <Field id={`${p}-desc`} label="Description" error={errors.description?.message}>
          <Textarea rows={2} {...describedBy(`${p}-desc`, errors.description?.message)} {...form.register("description")} />
        </Field>
        <div className="flex gap-2">
          <Button type="submit" disabled={create.isPending}>{editing ? "Save changes" : "Add board model"}</Button>
          {editing && onDone && (
            <Button type="button" variant="secondary" onClick={onDone}>Cancel</Button>
          )}
        </div>
      </form>
    </Panel>
  );
}

const REVISION_DEFAULTS: Partial<BoardRevisionBody> = { pwmFrequencyHz: 25000, tachPulsesPerRev: 2, notes: "" };

export function BoardRevisionForm({ boardModels }: { boardModels: BoardModelView[] }) {
  const qc = useQueryClient();
  const [boardModelId, setBoardModelId] = useState(boardModels[0]?.id ?? "");
  const form = useForm<BoardRevisionBody>({ resolver: boardRevisionBodyResolver, defaultValues: REVISION_DEFAULTS });
  const create = useMutation({
    mutationFn: (v: BoardRevisionBody) => apiCall(createBoardRevision, { params: { id: boardModelId }, body: v }),
    onSuccess: () => {
      form.reset(REVISION_DEFAULTS);
      void qc.invalidateQueries({ queryKey: operationKey(listBoardModels) });
    },
    onError: (err) => showServerIssues(form, err),
  });
  const { errors } = form.formState;
  const num = (name: keyof BoardRevisionBody) => form.register(name, { setValueAs: (v: string) => (v === "" ? Number.NaN : Number(v)) });
  return (
    <Panel title="Add a board revision">
      <form onSubmit={(e) => void form.handleSubmit((v) => create.mutate(v))(e)} className="grid gap-3 md:grid-cols-2" noValidate>
        {create.error && <div className="md:col-span-2"><ErrorNotice error={create.error} besideFields={fieldsOf(form)} /></div>}
        <Field id="br-model" label="Board model">
          <Select id="br-model" value={boardModelId} onChange={(e) => setBoardModelId(e.target.value)}>
            {boardModels.map((b) => <option key={b.id} value={b.id}>{b.name}</option>)}
          </Select>
        </Field>
        <Field id="br-rev" label="Revision" hint="Semantic version, e.g. 2.1.0." error={errors.revision?.message}>
          <Input {...describedBy("br-rev", errors.revision?.message)} {...form.register("revision")} />
        </Field>
        <NumberField id="br-mem" label="Profile memory (bytes)" error={errors.memoryBytes?.message} reg={num("memoryBytes")} step="1" />
        <Field id="br-base" label="Base address" hint="Decimal, or hex as 0x0801F800." error={errors.baseAddress?.message}>
          <Input
            {...describedBy("br-base", errors.baseAddress?.message)}
            {...form.register("baseAddress", { setValueAs: (v: string) => (v.trim() === "" ? Number.NaN : Number(v.trim())) })}
          />
        </Field>
        <NumberField id="br-slots" label="Profile slots" error={errors.slotCount?.message} reg={num("slotCount")} step="1" />
        <NumberField id="br-points" label="Max points per curve" error={errors.maxPointsPerCurve?.message} reg={num("maxPointsPerCurve")} step="1" />
        <NumberField id="br-pwm" label="PWM frequency (Hz)" error={errors.pwmFrequencyHz?.message} reg={num("pwmFrequencyHz")} step="1" />
        <NumberField id="br-tach" label="Tach pulses per revolution" error={errors.tachPulsesPerRev?.message} reg={num("tachPulsesPerRev")} step="1" />
        <div className="md:col-span-2">
          <Field id="br-notes" label="Notes" error={errors.notes?.message}>
            <Textarea rows={2} {...describedBy("br-notes", errors.notes?.message)} {...form.register("notes")} />
          </Field>
        </div>
        <div className="md:col-span-2">
          <Button type="submit" disabled={create.isPending || !boardModelId}>Add revision</Button>
        </div>
      </form>
    </Panel>
  );
}

const revisionBodyOf = (r: BoardRevisionView): BoardRevisionBody => ({
  revision: r.revision,
  memoryBytes: r.memoryBytes,
  baseAddress: r.baseAddress,
  slotCount: r.slotCount,
  maxPointsPerCurve: r.maxPointsPerCurve,
  pwmFrequencyHz: r.pwmFrequencyHz,
  tachPulsesPerRev: r.tachPulsesPerRev,
  notes: r.notes,
});

/** Corrects a revision's limits; once boards of it shipped the server only accepts note changes. */
export function BoardRevisionEditForm({ revision, onDone }: { revision: BoardRevisionView; onDone: () => void }) {
  const qc = useQueryClient();
  const form = useForm<BoardRevisionBody>({ resolver: boardRevisionBodyResolver, defaultValues: revisionBodyOf(revision) });
  const save = useMutation({
    mutationFn: (v: BoardRevisionBody) => apiCall(updateBoardRevision, { params: { id: revision.id }, body: v }),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: operationKey(getBoardRevision, { params: { id: revision.id } }) });
      void qc.invalidateQueries({ queryKey: operationKey(listBoardModels) });
      onDone();
    },
    onError: (err) => showServerIssues(form, err),
  });
  const { errors } = form.formState;
  const num = (name: keyof BoardRevisionBody) => form.register(name, { setValueAs: (v: string) => (v === "" ? Number.NaN : Number(v)) });
  return (
    <Panel title={`Edit revision ${revision.revision}`}>
      <form onSubmit={(e) => void form.handleSubmit((v) => save.mutate(v))(e)} className="grid gap-3 md:grid-cols-2" noValidate>
        {save.error && <div className="md:col-span-2"><ErrorNotice error={save.error} besideFields={fieldsOf(form)} /></div>}
        <Field id="bre-rev" label="Revision" hint="Semantic version, e.g. 2.1.0." error={errors.revision?.message}>
          <Input {...describedBy("bre-rev", errors.revision?.message)} {...form.register("revision")} />
        </Field>
        <NumberField id="bre-mem" label="Profile memory (bytes)" error={errors.memoryBytes?.message} reg={num("memoryBytes")} step="1" />
        <Field id="bre-base" label="Base address" hint="Decimal, or hex as 0x0801F800." error={errors.baseAddress?.message}>
          <Input
            {...describedBy("bre-base", errors.baseAddress?.message)}
            {...form.register("baseAddress", { setValueAs: (v: string | number) => (String(v).trim() === "" ? Number.NaN : Number(String(v).trim())) })}
          />
        </Field>
        <NumberField id="bre-slots" label="Profile slots" error={errors.slotCount?.message} reg={num("slotCount")} step="1" />
        <NumberField id="bre-points" label="Max points per curve" error={errors.maxPointsPerCurve?.message} reg={num("maxPointsPerCurve")} step="1" />
        <NumberField id="bre-pwm" label="PWM frequency (Hz)" error={errors.pwmFrequencyHz?.message} reg={num("pwmFrequencyHz")} step="1" />
        <NumberField id="bre-tach" label="Tach pulses per revolution" error={errors.tachPulsesPerRev?.message} reg={num("tachPulsesPerRev")} step="1" />
        <div className="md:col-span-2">
          <Field id="bre-notes" label="Notes" error={errors.notes?.message}>
            <Textarea rows={2} {...describedBy("bre-notes", errors.notes?.message)} {...form.register("notes")} />
          </Field>
        </div>
        <div className="flex gap-2 md:col-span-2">
          <Button type="submit" disabled={save.isPending}>Save changes</Button>
          <Button type="button" variant="secondary" onClick={onDone}>Cancel</Button>
        </div>
      </form>
    </Panel>
  );
}
