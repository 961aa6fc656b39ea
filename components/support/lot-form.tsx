"use client";

import { useMutation, useQueryClient } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import { apiCall, operationKey } from "@/lib/api/client";
import { createLot, listLots } from "@/lib/api/endpoints";
import type { LotOptions } from "@/lib/api/operations/support";
import type { LotInput } from "@/lib/lots/input";
import { Button } from "@/components/ui/button";
import { lazyZodResolver } from "@/components/ui/lazy-resolver";
import { Field, Input, Select, describedBy } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { ErrorNotice } from "@/components/ui/error-notice";
import { fieldsOf, showServerIssues } from "@/components/ui/server-issues";
import { Panel } from "@/components/ui/panel";

/** Client-side checks with the API body's own schema, loaded when the form first validates. */
const lotBodyResolver = lazyZodResolver(() => import("@/lib/api/operations/support").then((m) => m.lotBody));

export function LotForm({ options }: { options: LotOptions | undefined }) {
  const qc = useQueryClient();
  const form = useForm<LotInput>({ resolver: lotBodyResolver, defaultValues: { producedOn: new Date().toISOString().slice(0, 10) } });
  const create = useMutation({
    mutationFn: (v: LotInput) => apiCall(createLot, { body: v }),
    onSuccess: () => {
      form.reset({ producedOn: form.getValues("producedOn"), line: form.getValues("line") });
      void qc.invalidateQueries({ queryKey: operationKey(listLots) });
    },
    onError: (err) => showServerIssues(form, err),
  });
  const { errors } = form.formState;
  const revisions = [...new Set((options?.boardModels ?? []).flatMap((m) => m.revisions))];
  const builds = (options?.boardModels ?? []).flatMap((m) => m.builds.filter((b) => b.stage !== "withdrawn").map((b) => ({ ...b, model: m.name })));
  return (
    <Panel title="Record a lot">
      <form className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4" onSubmit={form.handleSubmit((v) => create.mutate(v))} noValidate>
        <Field id="lot-code" label="Lot code" error={errors.lotCode?.message} hint="e.g. TW-2507">
          <Input {...describedBy("lot-code", errors.lotCode?.message)} {...form.register("lotCode")} />
        </Field>
        <Field id="lot-revision" label="Board revision" error={errors.boardRevision?.message}>
          <Select {...describedBy("lot-revision", errors.boardRevision?.message)} {...form.register("boardRevision")} defaultValue="">
            <option value="" disabled>Choose…</option>
            {revisions.map((r) => <option key={r} value={r}>{r}</option>)}
          </Select>
        </Field>
        <Field id="lot-build" label="Build" error={errors.buildVersion?.message} hint="Pilot or production builds only.">
          <Select {...describedBy("lot-build", errors.buildVersion?.message)} {...form.register("buildVersion")} defaultValue="">
            <option value="" disabled>Choose…</option>
            {builds.map((b) => <option key={b.id} value={b.version}>{b.model} {b.version} ({b.stage}, rev {b.revisionRange})</option>)}
          </Select>
        </Field>
        <Field id="lot-line" label="Production line" error={errors.line?.message}>
          <Input {...describedBy("lot-line", errors.line?.message)} {...form.register("line")} />
        </Field>
        <Field id="lot-from" label="First serial" error={errors.serialFrom?.message} hint="e.g. TC1-00080000">
          <Input {...describedBy("lot-from", errors.serialFrom?.message)} {...form.register("serialFrom")} autoComplete="off" />
        </Field>
        <Field id="lot-to" label="Last serial" error={errors.serialTo?.message} hint="Inclusive.">
          <Input {...describedBy("lot-to", errors.serialTo?.message)} {...form.register("serialTo")} autoComplete="off" />
        </Field>
        <Field id="lot-date" label="Production date" error={errors.producedOn?.message}>
          <Input type="date" {...describedBy("lot-date", errors.producedOn?.message)} {...form.register("producedOn")} />
        </Field>
        <div className="flex items-end">
          <Button type="submit" disabled={create.isPending}>{create.isPending ? "Recording…" : "Record lot"}</Button>
        </div>
      </form>
      {create.error && <div className="mt-3"><ErrorNotice error={create.error} besideFields={fieldsOf(form)} /></div>}
      {create.data && <div className="mt-3"><Notice tone="ok" role="status">Lot {create.data.lot.lotCode} recorded: {create.data.lot.boards.toLocaleString("en")} boards.</Notice></div>}
    </Panel>
  );
}
