"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { apiFetch } from "@/lib/api/client";
import type { AppError } from "@/lib/api/errors";
import { boardModelBody, boardRevisionBody, type BoardModelBody, type BoardModelView, type BoardRevisionBody } from "@/lib/api/operations/registry-schemas";
import { Button } from "@/components/ui/button";
import { Field, Input, Select, Textarea, describedBy } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import { NumberField } from "./number-field";

export function BoardModelForm() {
  const qc = useQueryClient();
  const form = useForm<BoardModelBody>({ resolver: zodResolver(boardModelBody), defaultValues: { description: "" } });
  const create = useMutation({
    mutationFn: (v: BoardModelBody) => apiFetch("/api/v1/board-models", { method: "POST", json: v }),
    onSuccess: () => {
      form.reset({ name: "", serialPrefix: "", description: "" });
      void qc.invalidateQueries({ queryKey: ["board-models"] });
    },
  });
  const { errors } = form.formState;
  return (
    <Panel title="Add a board model">
      <form onSubmit={(e) => void form.handleSubmit((v) => create.mutate(v))(e)} className="space-y-3" noValidate>
        {create.error && <Notice tone="fault" role="alert">{(create.error as AppError).message}</Notice>}
        <Field id="bm-name" label="Name" error={errors.name?.message}>
          <Input {...describedBy("bm-name", errors.name?.message)} {...form.register("name")} />
        </Field>
        <Field id="bm-prefix" label="Serial prefix" hint="2–8 capital letters or digits." error={errors.serialPrefix?.message}>
          <Input {...describedBy("bm-prefix", errors.serialPrefix?.message)} {...form.register("serialPrefix")} />
        </Field>
        <Field id="bm-desc" label="Description" error={errors.description?.message}>
          <Textarea rows={2} {...describedBy("bm-desc", errors.description?.message)} {...form.register("description")} />
        </Field>
        <Button type="submit" disabled={create.isPending}>Add board model</Button>
      </form>
    </Panel>
  );
}

const REVISION_DEFAULTS: Partial<BoardRevisionBody> = { pwmFrequencyHz: 25000, tachPulsesPerRev: 2, notes: "" };

export function BoardRevisionForm({ boardModels }: { boardModels: BoardModelView[] }) {
  const qc = useQueryClient();
  const [boardModelId, setBoardModelId] = useState(boardModels[0]?.id ?? "");
  const form = useForm<BoardRevisionBody>({ resolver: zodResolver(boardRevisionBody), defaultValues: REVISION_DEFAULTS });
  const create = useMutation({
    mutationFn: (v: BoardRevisionBody) => apiFetch(`/api/v1/board-models/${boardModelId}/revisions`, { method: "POST", json: v }),
    onSuccess: () => {
      form.reset(REVISION_DEFAULTS);
      void qc.invalidateQueries({ queryKey: ["board-models"] });
    },
  });
  const { errors } = form.formState;
  const num = (name: keyof BoardRevisionBody) => form.register(name, { setValueAs: (v: string) => (v === "" ? Number.NaN : Number(v)) });
  return (
    <Panel title="Add a board revision">
      <form onSubmit={(e) => void form.handleSubmit((v) => create.mutate(v))(e)} className="grid gap-3 md:grid-cols-2" noValidate>
        {create.error && <div className="md:col-span-2"><Notice tone="fault" role="alert">{(create.error as AppError).message}</Notice></div>}
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
