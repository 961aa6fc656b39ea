"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { useForm, type UseFormReturn } from "react-hook-form";
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
import { REVISION_NUMBER_FIELDS, REVISION_NUMBER_KEYS, REVISION_TEXT_FIELDS, revisionFieldsOf, revisionNumberLabel } from "@/lib/registry/revision-fields";

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

/** A number typed in a box, or an address typed as decimal or 0x… hex; empty is NaN, which the schema refuses with the field's message. */
const numberFromText = (v: string | number) => (String(v).trim() === "" ? Number.NaN : Number(String(v).trim()));

/** A board revision's fields in form order, from their one definition (lib/registry/revision-fields). */
function RevisionInputs({ form, idPrefix }: { form: UseFormReturn<BoardRevisionBody>; idPrefix: string }) {
  const { errors } = form.formState;
  const { revision, notes } = REVISION_TEXT_FIELDS;
  return (
    <>
      <Field id={`${idPrefix}-revision`} label={revision.label} hint={revision.hint} error={errors.revision?.message}>
        <Input {...describedBy(`${idPrefix}-revision`, errors.revision?.message)} {...form.register("revision")} />
      </Field>
      {REVISION_NUMBER_KEYS.map((key) => {
        const f = REVISION_NUMBER_FIELDS[key];
        const id = `${idPrefix}-${key}`;
        const error = errors[key]?.message;
        const reg = form.register(key, { setValueAs: numberFromText });
        return f.hex ? (
          <Field key={key} id={id} label={revisionNumberLabel(f)} hint={f.hint} error={error}>
            <Input {...describedBy(id, error)} {...reg} />
          </Field>
        ) : (
          <NumberField key={key} id={id} label={revisionNumberLabel(f)} hint={f.hint} error={error} reg={reg} step="1" />
        );
      })}
      <div className="md:col-span-2">
        <Field id={`${idPrefix}-notes`} label={notes.label} error={errors.notes?.message}>
          <Textarea rows={2} {...describedBy(`${idPrefix}-notes`, errors.notes?.message)} {...form.register("notes")} />
        </Field>
      </div>
    </>
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
  return (
    <Panel title="Add a board revision">
      <form onSubmit={(e) => void form.handleSubmit((v) => create.mutate(v))(e)} className="grid gap-3 md:grid-cols-2" noValidate>
        {create.error && <div className="md:col-span-2"><ErrorNotice error={create.error} besideFields={fieldsOf(form)} /></div>}
        <Field id="br-model" label="Board model">
          <Select id="br-model" value={boardModelId} onChange={(e) => setBoardModelId(e.target.value)}>
            {boardModels.map((b) => <option key={b.id} value={b.id}>{b.name}</option>)}
          </Select>
        </Field>
        <RevisionInputs form={form} idPrefix="br" />
        <div className="md:col-span-2">
          <Button type="submit" disabled={create.isPending || !boardModelId}>Add revision</Button>
        </div>
      </form>
    </Panel>
  );
}

/** Corrects a revision's limits; once boards of it shipped the server only accepts note changes. */
export function BoardRevisionEditForm({ revision, onDone }: { revision: BoardRevisionView; onDone: () => void }) {
  const qc = useQueryClient();
  const form = useForm<BoardRevisionBody>({ resolver: boardRevisionBodyResolver, defaultValues: revisionFieldsOf(revision) });
  const save = useMutation({
    mutationFn: (v: BoardRevisionBody) => apiCall(updateBoardRevision, { params: { id: revision.id }, body: v }),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: operationKey(getBoardRevision, { params: { id: revision.id } }) });
      void qc.invalidateQueries({ queryKey: operationKey(listBoardModels) });
      onDone();
    },
    onError: (err) => showServerIssues(form, err),
  });
  return (
    <Panel title={`Edit revision ${revision.revision}`}>
      <form onSubmit={(e) => void form.handleSubmit((v) => save.mutate(v))(e)} className="grid gap-3 md:grid-cols-2" noValidate>
        {save.error && <div className="md:col-span-2"><ErrorNotice error={save.error} besideFields={fieldsOf(form)} /></div>}
        <RevisionInputs form={form} idPrefix="bre" />
        <div className="flex gap-2 md:col-span-2">
          <Button type="submit" disabled={save.isPending}>Save changes</Button>
          <Button type="button" variant="secondary" onClick={onDone}>Cancel</Button>
        </div>
      </form>
    </Panel>
  );
}
