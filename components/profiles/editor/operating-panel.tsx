"use client";

import dynamic from "next/dynamic";
import { memo, useMemo } from "react";
import type { CoolingProfile, HardwareContext, OperatingPoint } from "@/lib/engine";
import { listenerDistanceProblem } from "@/lib/acoustics/near-field";
import { safeLoadSweep } from "@/lib/registry/editor-evaluation";
import { Field, Input } from "@/components/ui/field";
import { useSettled } from "./use-settled";

// memo: the chart (recharts, the heaviest thing on the page to redraw) redraws only for new rows.
const SweepChart = memo(dynamic(() => import("../charts/sweep-chart"), { ssr: false, loading: () => <div className="h-60 animate-pulse rounded bg-ink-100" /> }));

/** How long the curve must rest before the load sweep chart redraws, ms. */
const SWEEP_SETTLE_MS = 250;

const fmt = (n: number, digits = 1) => n.toFixed(digits);

/** The heat load, ambient and listener distance the operating point is taken at, as typed. */
export interface OperatingInputs {
  heatLoadW: string;
  ambientC: string;
  distanceM: string;
}

/**
 * The typed inputs as numbers, or the error to show beside each. The listener distance is
 * judged by the engine's own rule (listenerDistanceProblem: refused inside the cooler's
 * near field), so the input and the computation cannot disagree.
 */
export function parseOperatingInputs({ heatLoadW, ambientC, distanceM }: OperatingInputs, hw: Pick<HardwareContext, "radiator"> | null) {
  const load = Number(heatLoadW);
  const ambient = Number(ambientC);
  const distance = distanceM.trim() === "" ? Number.NaN : Number(distanceM);
  const loadError = heatLoadW.trim() === "" || !Number.isFinite(load) || load < 0 || load > 2000 ? "Enter a heat load from 0 to 2,000 W." : undefined;
  const ambientError = ambientC.trim() === "" || !Number.isFinite(ambient) || ambient < -20 || ambient > 60 ? "Enter an ambient from −20 to 60 °C." : undefined;
  const distanceError = hw ? (listenerDistanceProblem(hw, distance) ?? undefined) : undefined;
  return { load, ambient, distance, loadError, ambientError, distanceError };
}

/**
 * Heat load and ambient in; settled liquid temperature, speeds and noise out, and a load sweep.
 * `point` is operatingPoint for these inputs (null when they are refused; without the listener
 * distance when that is refused), computed once per edit by the workspace, which also marks it
 * on the live plot.
 */
export function OperatingPanel({ profile, hw, point, inputs, onInputs }: { profile: CoolingProfile; hw: HardwareContext; point: OperatingPoint | null; inputs: OperatingInputs; onInputs: (next: OperatingInputs) => void }) {
  const { heatLoadW, ambientC, distanceM } = inputs;
  const { ambient, loadError, ambientError, distanceError } = parseOperatingInputs(inputs, hw);
  // The sweep (31 operating points) is computed only once the curve has rested, for the chart that shows it then.
  const sweepInputs = useMemo(() => ({ profile, hw, ambientC: ambientError ? null : ambient }), [profile, hw, ambient, ambientError]);
  const settled = useSettled(sweepInputs, SWEEP_SETTLE_MS);
  const shownSweep = useMemo(
    () =>
      settled.ambientC === null
        ? []
        : safeLoadSweep(settled.profile, settled.hw, settled.ambientC).map((p) => ({ heatLoadW: p.heatLoadW, liquidTempC: Math.round(p.liquidTempC * 10) / 10, soundDbA: Math.round(p.noise.totalDbA1m * 10) / 10 })),
    [settled],
  );
  return (
    <div className="space-y-3">
      <div className="grid grid-cols-3 gap-3">
        <Field id="op-load" label="Heat load (W)" error={loadError}>
          <Input id="op-load" type="number" inputMode="decimal" value={heatLoadW} onChange={(e) => onInputs({ ...inputs, heatLoadW: e.target.value })} aria-invalid={loadError ? true : undefined} />
        </Field>
        <Field id="op-ambient" label="Ambient (°C)" error={ambientError}>
          <Input id="op-ambient" type="number" inputMode="decimal" value={ambientC} onChange={(e) => onInputs({ ...inputs, ambientC: e.target.value })} aria-invalid={ambientError ? true : undefined} />
        </Field>
        <Field id="op-distance" label="Listener distance (m)" error={distanceError}>
          <Input id="op-distance" type="number" inputMode="decimal" step="any" value={distanceM} onChange={(e) => onInputs({ ...inputs, distanceM: e.target.value })} aria-invalid={distanceError ? true : undefined} aria-describedby={distanceError ? "op-distance-error" : undefined} />
        </Field>
      </div>
      {point && (
        <dl className="grid grid-cols-2 gap-2 text-sm sm:grid-cols-3" aria-live="polite">
          <div><dt className="text-ink-600">Settled liquid</dt><dd className={`font-semibold tabular-nums ${point.holdsBelowCritical ? "" : "text-signal-fault"}`}>{fmt(point.liquidTempC)} °C</dd></div>
          <div><dt className="text-ink-600">Pump</dt><dd className="tabular-nums">{Math.round(point.pump.rpm)} RPM · {fmt(point.pump.dutyPct)} %</dd></div>
          <div><dt className="text-ink-600">Fans</dt><dd className="tabular-nums">{point.fans.stopped ? "stopped" : `${Math.round(point.fans.rpm)} RPM · ${fmt(point.fans.dutyPct)} %`}</dd></div>
          <div><dt className="text-ink-600">Sound at 1 m</dt><dd className="tabular-nums">{fmt(point.noise.totalDbA1m)} dB(A)</dd></div>
          {!distanceError && point.noise.distanceM !== 1 && (
            <div><dt className="text-ink-600">Sound at {point.noise.distanceM} m</dt><dd className="tabular-nums">{fmt(point.noise.totalDbAAtDistance)} dB(A)</dd></div>
          )}
          <div><dt className="text-ink-600">Coolant rise</dt><dd className="tabular-nums">{fmt(point.coolantRiseK, 2)} K</dd></div>
          <div><dt className="text-ink-600">Below critical?</dt><dd>{point.holdsBelowCritical ? "yes" : "no — the curve cannot hold this load"}</dd></div>
        </dl>
      )}
      {shownSweep.length > 0 && <SweepChart rows={shownSweep} />}
    </div>
  );
}
