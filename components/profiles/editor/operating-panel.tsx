"use client";

import dynamic from "next/dynamic";
import { useMemo } from "react";
import { operatingPoint, type CoolingProfile, type HardwareContext } from "@/lib/engine";
import { safeLoadSweep } from "@/lib/registry/editor-evaluation";
import { Field, Input } from "@/components/ui/field";

const SweepChart = dynamic(() => import("../charts/sweep-chart"), { ssr: false, loading: () => <div className="h-60 animate-pulse rounded bg-ink-100" /> });

const fmt = (n: number, digits = 1) => n.toFixed(digits);

/** The heat load and ambient the operating point is taken at, as typed. */
export interface OperatingInputs {
  heatLoadW: string;
  ambientC: string;
}

/** The typed inputs as numbers, or the error to show beside each. */
export function parseOperatingInputs({ heatLoadW, ambientC }: OperatingInputs) {
  const load = Number(heatLoadW);
  const ambient = Number(ambientC);
  const loadError = heatLoadW.trim() === "" || !Number.isFinite(load) || load < 0 || load > 2000 ? "Enter a heat load from 0 to 2,000 W." : undefined;
  const ambientError = ambientC.trim() === "" || !Number.isFinite(ambient) || ambient < -20 || ambient > 60 ? "Enter an ambient from −20 to 60 °C." : undefined;
  return { load, ambient, loadError, ambientError };
}

/** Heat load and ambient in; settled liquid temperature, speeds and noise out (operatingPoint), and a load sweep. */
export function OperatingPanel({ profile, hw, inputs, onInputs }: { profile: CoolingProfile; hw: HardwareContext; inputs: OperatingInputs; onInputs: (next: OperatingInputs) => void }) {
  const { heatLoadW, ambientC } = inputs;
  const { load, ambient, loadError, ambientError } = parseOperatingInputs(inputs);
  const point = useMemo(() => {
    if (loadError || ambientError) return null;
    try {
      return operatingPoint(profile, hw, { heatLoadW: load, ambientC: ambient });
    } catch {
      return null;
    }
  }, [profile, hw, load, ambient, loadError, ambientError]);
  const sweep = useMemo(
    () => (ambientError ? [] : safeLoadSweep(profile, hw, ambient).map((p) => ({ heatLoadW: p.heatLoadW, liquidTempC: Math.round(p.liquidTempC * 10) / 10, soundDbA: Math.round(p.noise.totalDbA1m * 10) / 10 }))),
    [profile, hw, ambient, ambientError],
  );
  return (
    <div className="space-y-3">
      <div className="grid grid-cols-2 gap-3">
        <Field id="op-load" label="Heat load (W)" error={loadError}>
          <Input id="op-load" type="number" inputMode="decimal" value={heatLoadW} onChange={(e) => onInputs({ ...inputs, heatLoadW: e.target.value })} aria-invalid={loadError ? true : undefined} />
        </Field>
        <Field id="op-ambient" label="Ambient (°C)" error={ambientError}>
          <Input id="op-ambient" type="number" inputMode="decimal" value={ambientC} onChange={(e) => onInputs({ ...inputs, ambientC: e.target.value })} aria-invalid={ambientError ? true : undefined} />
        </Field>
      </div>
      {point && (
        <dl className="grid grid-cols-2 gap-2 text-sm sm:grid-cols-3" aria-live="polite">
          <div><dt className="text-ink-600">Settled liquid</dt><dd className={`font-semibold tabular-nums ${point.holdsBelowCritical ? "" : "text-signal-fault"}`}>{fmt(point.liquidTempC)} °C</dd></div>
          <div><dt className="text-ink-600">Pump</dt><dd className="tabular-nums">{Math.round(point.pump.rpm)} RPM · {fmt(point.pump.dutyPct)} %</dd></div>
          <div><dt className="text-ink-600">Fans</dt><dd className="tabular-nums">{point.fans.stopped ? "stopped" : `${Math.round(point.fans.rpm)} RPM · ${fmt(point.fans.dutyPct)} %`}</dd></div>
          <div><dt className="text-ink-600">Sound at 1 m</dt><dd className="tabular-nums">{fmt(point.noise.totalDbA1m)} dB(A)</dd></div>
          <div><dt className="text-ink-600">Coolant rise</dt><dd className="tabular-nums">{fmt(point.coolantRiseK, 2)} K</dd></div>
          <div><dt className="text-ink-600">Below critical?</dt><dd>{point.holdsBelowCritical ? "yes" : "no — the curve cannot hold this load"}</dd></div>
        </dl>
      )}
      {sweep.length > 0 && <SweepChart rows={sweep} />}
    </div>
  );
}
