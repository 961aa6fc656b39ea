"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import { apiCall, apiQuery, operationKey } from "@/lib/api/client";
import { createCoolerModel, listBoardModels, listComponents, listCoolerModels, updateCoolerModel } from "@/lib/api/endpoints";
import { ALL_COMPONENTS } from "@/lib/api/limits";
import type { CoolerModelBody, CoolerModelView } from "@/lib/api/operations/registry-schemas";
import { Button } from "@/components/ui/button";
import { lazyZodResolver } from "@/components/ui/lazy-resolver";
import { Field, Input, Select, describedBy } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import { NumberField } from "./number-field";
import { ErrorNotice } from "@/components/ui/error-notice";
import { fieldsOf, showServerIssues } from "@/components/ui/server-issues";

const bodyOf = (c: CoolerModelView): CoolerModelBody => ({
  name: c.name,
  radiatorMm: c.radiatorMm,
  fanComponentId: c.fanComponentId,
  fanCount: c.fanCount,
  pumpComponentId: c.pumpComponentId,
  boardModelId: c.boardModelId,
  radiatorKPerWAtMinFan: c.radiatorKPerWAtMinFan,
  radiatorKPerWAtMaxFan: c.radiatorKPerWAtMaxFan,
});

/** Client-side checks with the API body's own schema, loaded when the form first validates. */
const coolerModelBodyResolver = lazyZodResolver(() => import("@/lib/api/operations/registry-schemas").then((m) => m.coolerModelBody));

/** Adds a cooler model, or edits `editing` in place (same schema as the API body). */
export function CoolerModelForm({ editing, onDone }: { editing?: CoolerModelView; onDone?: () => void }) {
  const qc = useQueryClient();
  const parts = useQuery(apiQuery(listComponents, { query: ALL_COMPONENTS }));
  const boards = useQuery(apiQuery(listBoardModels, {}));
  const form = useForm<CoolerModelBody>({ resolver: coolerModelBodyResolver, defaultValues: editing ? bodyOf(editing) : undefined });
  const create = useMutation({
    mutationFn: (v: CoolerModelBody) =>
      editing ? apiCall(updateCoolerModel, { params: { id: editing.id }, body: v }) : apiCall(createCoolerModel, { body: v }),
    onSuccess: () => {
      if (!editing) form.reset();
      void qc.invalidateQueries({ queryKey: operationKey(listCoolerModels) });
      onDone?.();
    },
    onError: (err) => showServerIssues(form, err),
  });
  const p = editing ? "cme" : "cm";
  const { errors } = form.formState;
  const num = (name: keyof CoolerModelBody) => form.register(name, { setValueAs: (v: string) => (v === "" ? Number.NaN : Number(v)) });
  const fans = parts.data?.items.filter((c) => c.kind === "fan") ?? [];
  const pumps = parts.data?.items.filter((c) => c.kind === "pump") ?? [];
  return (
    <Panel title={editing ? `Edit ${editing.name}` : "Add a cooler model"}>
      <form onSubmit={(e) => void form.handleSubmit((v) => create.mutate(v))(e)} className="grid max-w-4xl gap-3 md:grid-cols-3" noValidate>
        {create.error && <div className="md:col-span-3"><ErrorNotice error={create.error} besideFields={fieldsOf(form)} /></div>}
        {create.isSuccess && !editing && <div className="md:col-span-3"><Notice tone="ok" role="status">Cooler model added.</Notice></div>}
        {editing && editing.profileCount > 0 && (
          <div className="md:col-span-3">
            <Notice tone="info">{editing.profileCount} profile(s) are written for this cooler: its board model stays fixed, and their plots follow the new figures.</Notice>
          </div>
        )}
        <Field id={`${p}-name`} label="Name" error={errors.name?.message}>
          <Input {...describedBy(`${p}-name`, errors.name?.message)} {...form.register("name")} />
        </Field>
        <NumberField id={`${p}-mm`} label="Radiator length (mm)" error={errors.radiatorMm?.message} reg={num("radiatorMm")} />
        <Field id={`${p}-board`} label="Board model" error={errors.boardModelId?.message}>
          <Select {...describedBy(`${p}-board`, errors.boardModelId?.message)} {...form.register("boardModelId")}>
            <option value="">Choose…</option>
            {boards.data?.items.map((b) => <option key={b.id} value={b.id}>{b.name}</option>)}
          </Select>
        </Field>
        <Field id={`${p}-fan`} label="Fan" error={errors.fanComponentId?.message}>
          <Select {...describedBy(`${p}-fan`, errors.fanComponentId?.message)} {...form.register("fanComponentId")}>
            <option value="">Choose…</option>
            {fans.map((c) => <option key={c.id} value={c.id}>{c.name}</option>)}
          </Select>
        </Field>
        <NumberField id={`${p}-fans`} label="Number of fans" error={errors.fanCount?.message} reg={num("fanCount")} />
        <Field id={`${p}-pump`} label="Pump" error={errors.pumpComponentId?.message}>
          <Select {...describedBy(`${p}-pump`, errors.pumpComponentId?.message)} {...form.register("pumpComponentId")}>
            <option value="">Choose…</option>
            {pumps.map((c) => <option key={c.id} value={c.id}>{c.name}</option>)}
          </Select>
        </Field>
        <NumberField id={`${p}-rmin`} label="Radiator K/W at minimum fan speed" error={errors.radiatorKPerWAtMinFan?.message} reg={num("radiatorKPerWAtMinFan")} />
        <NumberField id={`${p}-rmax`} label="Radiator K/W at maximum fan speed" error={errors.radiatorKPerWAtMaxFan?.message} reg={num("radiatorKPerWAtMaxFan")} />
        <div className="md:col-span-3">
          <div className="flex gap-2">
            <Button type="submit" disabled={create.isPending}>{editing ? "Save changes" : "Add cooler model"}</Button>
            {editing && onDone && (
              <Button type="button" variant="secondary" onClick={onDone}>Cancel</Button>
            )}
          </div>
        </div>
      </form>
    </Panel>
  );
}
