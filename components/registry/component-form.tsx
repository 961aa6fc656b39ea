"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import { apiCall, operationKey } from "@/lib/api/client";
import { createComponent, listComponents } from "@/lib/api/endpoints";
import type { ComponentBody } from "@/lib/api/operations/registry-schemas";
import { Button } from "@/components/ui/button";
import { lazyZodResolver } from "@/components/ui/lazy-resolver";
import { Field, Input, Select, Textarea, describedBy } from "@/components/ui/field";
import { parseSoundTableText } from "@/lib/registry/sound-table-text";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import { NumberField } from "./number-field";
import { ErrorNotice } from "@/components/ui/error-notice";
import { fieldsOf, showServerIssues } from "@/components/ui/server-issues";

const DEFAULTS: Partial<ComponentBody> = { kind: "fan", tachPulsesPerRev: 2, soundExponent: 50, soundTable: null, stopsAtZeroDuty: false, flowAtMaxRpmLpm: null };

/** The first message zod gave anywhere inside the sound table (its distance, a point, the order). */
function soundTableError(e: unknown): string | undefined {
  if (typeof e !== "object" || e === null) return undefined;
  const own = (e as { message?: unknown }).message;
  if (typeof own === "string") return own;
  for (const [key, value] of Object.entries(e)) {
    if (key === "ref" || key === "type") continue;
    const inner = soundTableError(value);
    if (inner) return inner;
  }
  return undefined;
}

/** Client-side checks with the API body's own schema, loaded when the form first validates. */
const componentBodyResolver = lazyZodResolver(() => import("@/lib/api/operations/registry-schemas").then((m) => m.componentBody));

export function ComponentForm() {
  const qc = useQueryClient();
  const form = useForm<ComponentBody>({ resolver: componentBodyResolver, defaultValues: DEFAULTS });
  const create = useMutation({
    mutationFn: (v: ComponentBody) => apiCall(createComponent, { body: v }),
    onSuccess: () => {
      form.reset(DEFAULTS);
      void qc.invalidateQueries({ queryKey: operationKey(listComponents) });
    },
    onError: (err) => showServerIssues(form, err),
  });
  const { errors } = form.formState;
  const num = (name: keyof ComponentBody) => form.register(name, { setValueAs: (v: string) => (v === "" ? Number.NaN : Number(v)) });
  return (
    <Panel title="Add a fan or pump">
      <form onSubmit={(e) => void form.handleSubmit((v) => create.mutate(v))(e)} className="grid max-w-4xl gap-3 md:grid-cols-3" noValidate>
        {create.error && <div className="md:col-span-3"><ErrorNotice error={create.error} besideFields={fieldsOf(form)} /></div>}
        {create.isSuccess && <div className="md:col-span-3"><Notice tone="ok" role="status">Component added.</Notice></div>}
        <Field id="c-name" label="Name" error={errors.name?.message}>
          <Input {...describedBy("c-name", errors.name?.message)} {...form.register("name")} />
        </Field>
        <Field id="c-kind" label="Kind" error={errors.kind?.message}>
          <Select {...describedBy("c-kind", errors.kind?.message)} {...form.register("kind")}>
            <option value="fan">Fan</option>
            <option value="pump">Pump</option>
          </Select>
        </Field>
        <NumberField id="c-min" label="Minimum duty (%)" error={errors.minDutyPct?.message} reg={num("minDutyPct")} />
        <NumberField id="c-rpm-min" label="RPM at minimum duty" error={errors.rpmAtMinDuty?.message} reg={num("rpmAtMinDuty")} />
        <NumberField id="c-rpm-max" label="Maximum RPM" error={errors.maxRpm?.message} reg={num("maxRpm")} />
        <NumberField id="c-tach" label="Tach pulses per revolution" error={errors.tachPulsesPerRev?.message} reg={num("tachPulsesPerRev")} />
        <NumberField id="c-db" label="Reference sound level, dB(A) at 1 m" error={errors.refSoundDbA?.message} reg={num("refSoundDbA")} />
        <NumberField id="c-ref-rpm" label="Reference RPM" error={errors.refRpm?.message} reg={num("refRpm")} />
        <NumberField id="c-exp" label="Sound exponent k" hint="50 by the fan laws; used only without a measured sound table." error={errors.soundExponent?.message} reg={num("soundExponent")} />
        <Field
          id="c-sound-table"
          label="Measured sound table (optional)"
          hint={'One measurement per line, "RPM dB(A)"; first line "at 1 m" for the microphone distance (1 m when left out). Replaces the reference level and exponent.'}
          error={soundTableError(errors.soundTable)}
        >
          <Textarea
            rows={4}
            placeholder={"at 1 m\n600 14\n1200 24\n2000 33"}
            {...describedBy("c-sound-table", soundTableError(errors.soundTable))}
            {...form.register("soundTable", { setValueAs: (v: unknown) => (typeof v === "string" ? parseSoundTableText(v) : v) })}
          />
        </Field>
        <div className="md:col-span-2 flex items-start gap-2 self-end text-sm">
          <input id="c-stops" type="checkbox" className="mt-1" {...form.register("stopsAtZeroDuty")} />
          <label htmlFor="c-stops">
            Stops at 0 % duty. Leave unticked for a motor that keeps its minimum speed below its minimum duty, 0 % included (4-wire PWM fan specification rev. 1.3 §3.4 allows both).
          </label>
        </div>
        <NumberField
          id="c-flow"
          label="Flow at max RPM (L/min)"
          hint="Pumps only; leave empty for fans."
          error={errors.flowAtMaxRpmLpm?.message}
          reg={form.register("flowAtMaxRpmLpm", { setValueAs: (v: string) => (v === "" || v === null ? null : Number(v)) })}
        />
        <div className="md:col-span-3">
          <Button type="submit" disabled={create.isPending}>Add component</Button>
        </div>
      </form>
    </Panel>
  );
}
