"use client";

import { useQuery } from "@tanstack/react-query";
import { useMemo } from "react";
import { apiQuery } from "@/lib/api/client";
import { listComponents, listCoolerModels } from "@/lib/api/endpoints";
import { ALL_COMPONENTS, ALL_COOLERS } from "@/lib/api/limits";
import type { ProfileDetailView } from "@/lib/api/operations/profile-schemas";
import type { ComponentFields, CoolerFields } from "@/lib/registry/hardware-context";
import { Select } from "@/components/ui/field";

/** One cooler the document can be evaluated on: its figures and its fan and pump. */
export interface CoolerChoice {
  id: string;
  cooler: CoolerFields;
  fan: ComponentFields;
  pump: ComponentFields;
  /** The cooler model the profile belongs to (what it is published for). */
  own: boolean;
}

/**
 * The profile's own cooler first (from the profile's answer, so it works even if the lists
 * fail), then the other cooler models on the same board model, whose parts come from the
 * component list.
 */
export function useCoolerChoices(detail: Pick<ProfileDetailView, "cooler" | "fan" | "pump">): { choices: CoolerChoice[]; loadError: boolean } {
  const coolers = useQuery(apiQuery(listCoolerModels, { query: ALL_COOLERS }));
  const parts = useQuery(apiQuery(listComponents, { query: ALL_COMPONENTS }));
  const { cooler, fan, pump } = detail;
  const choices = useMemo(() => {
    const own: CoolerChoice = { id: cooler.id, cooler, fan, pump, own: true };
    const byId = new Map((parts.data?.items ?? []).map((c) => [c.id, c]));
    const others = (coolers.data?.items ?? [])
      .filter((c) => c.id !== cooler.id && c.boardModelName === cooler.boardModelName)
      .flatMap((c): CoolerChoice[] => {
        const f = byId.get(c.fanComponentId);
        const p = byId.get(c.pumpComponentId);
        return f && p ? [{ id: c.id, cooler: c, fan: f, pump: p, own: false }] : [];
      });
    return [own, ...others];
  }, [cooler, fan, pump, coolers.data, parts.data]);
  return { choices, loadError: coolers.isError || parts.isError };
}

export function CoolerPicker({ choices, value, onChange, loadError }: { choices: CoolerChoice[]; value: string; onChange: (id: string) => void; loadError: boolean }) {
  return (
    <label className="text-sm">
      <span className="mb-1 block font-medium text-ink-800">Evaluate on cooler</span>
      <Select value={value} onChange={(e) => onChange(e.target.value)} className="w-72" aria-describedby={loadError ? "cooler-picker-error" : undefined}>
        {choices.map((c) => (
          <option key={c.id} value={c.id}>
            {c.cooler.name}
            {c.own ? " (this profile's cooler)" : ""} · {c.cooler.fanCount} × {c.fan.name}
          </option>
        ))}
      </Select>
      {loadError && (
        <span id="cooler-picker-error" className="mt-1 block text-xs text-signal-fault">
          Other cooler models could not be loaded; only this profile&apos;s cooler is offered.
        </span>
      )}
    </label>
  );
}
