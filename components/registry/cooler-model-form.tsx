"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import { apiFetch } from "@/lib/api/client";
import type { AppError } from "@/lib/api/errors";
import { coolerModelBody, type BoardModelView, type ComponentView, type CoolerModelBody } from "@/lib/api/operations/registry-schemas";
import { Button } from "@/components/ui/button";
import { Field, Input, Select, describedBy } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import type { ServerPage } from "./data-table";
import { NumberField } from "./number-field";

export function CoolerModelForm() {
  const qc = useQueryClient();
  const parts = useQuery({ queryKey: ["components", "all"], queryFn: () => apiFetch<ServerPage<ComponentView>>("/api/v1/components?pageSize=100") });
  const boards = useQuery({ queryKey: ["board-models"], queryFn: () => apiFetch<{ items: BoardModelView[] }>("/api/v1/board-models") });
  const form = useForm<CoolerModelBody>({ resolver: zodResolver(coolerModelBody) });
  const create = useMutation({
    mutationFn: (v: CoolerModelBody) => apiFetch("/api/v1/cooler-models", { method: "POST", json: v }),
    onSuccess: () => {
      form.reset();
      void qc.invalidateQueries({ queryKey: ["cooler-models"] });
    },
  });
  const { errors } = form.formState;
  const num = (name: keyof CoolerModelBody) => form.register(name, { setValueAs: (v: string) => (v === "" ? Number.NaN : Number(v)) });
  const fans = parts.data?.items.filter((c) => c.kind === "fan") ?? [];
  const pumps = parts.data?.items.filter((c) => c.kind === "pump") ?? [];
  return (
    <Panel title="Add a cooler model">
      <form onSubmit={(e) => void form.handleSubmit((v) => create.mutate(v))(e)} className="grid max-w-4xl gap-3 md:grid-cols-3" noValidate>
        {create.error && <div className="md:col-span-3"><Notice tone="fault" role="alert">{(create.error as AppError).message}</Notice></div>}
        {create.isSuccess && <div className="md:col-span-3"><Notice tone="ok" role="status">Cooler model added.</Notice></div>}
        <Field id="cm-name" label="Name" error={errors.name?.message}>
          <Input {...describedBy("cm-name", errors.name?.message)} {...form.register("name")} />
        </Field>
        <NumberField id="cm-mm" label="Radiator length (mm)" error={errors.radiatorMm?.message} reg={num("radiatorMm")} />
        <Field id="cm-board" label="Board model" error={errors.boardModelId?.message}>
          <Select {...describedBy("cm-board", errors.boardModelId?.message)} {...form.register("boardModelId")}>
            <option value="">Choose…</option>
            {boards.data?.items.map((b) => <option key={b.id} value={b.id}>{b.name}</option>)}
          </Select>
        </Field>
        <Field id="cm-fan" label="Fan" error={errors.fanComponentId?.message}>
          <Select {...describedBy("cm-fan", errors.fanComponentId?.message)} {...form.register("fanComponentId")}>
            <option value="">Choose…</option>
            {fans.map((c) => <option key={c.id} value={c.id}>{c.name}</option>)}
          </Select>
        </Field>
        <NumberField id="cm-fans" label="Number of fans" error={errors.fanCount?.message} reg={num("fanCount")} />
        <Field id="cm-pump" label="Pump" error={errors.pumpComponentId?.message}>
          <Select {...describedBy("cm-pump", errors.pumpComponentId?.message)} {...form.register("pumpComponentId")}>
            <option value="">Choose…</option>
            {pumps.map((c) => <option key={c.id} value={c.id}>{c.name}</option>)}
          </Select>
        </Field>
        <NumberField id="cm-rmin" label="Radiator K/W at minimum fan speed" error={errors.radiatorKPerWAtMinFan?.message} reg={num("radiatorKPerWAtMinFan")} />
        <NumberField id="cm-rmax" label="Radiator K/W at maximum fan speed" error={errors.radiatorKPerWAtMaxFan?.message} reg={num("radiatorKPerWAtMaxFan")} />
        <div className="md:col-span-3">
          <Button type="submit" disabled={create.isPending}>Add cooler model</Button>
        </div>
      </form>
    </Panel>
  );
}
