"use client";

import { memo, useMemo, type KeyboardEvent } from "react";
import type { CoolingProfile, CurveKind, HardwareContext } from "@/lib/engine";
import { pointRows } from "@/lib/registry/editor-evaluation";
import { Button } from "@/components/ui/button";
import type { CurveEditing } from "./use-curve-editing";

const fmt = (n: number) => String(Math.round(n * 1000) / 1000);
const noun = (kind: CurveKind) => (kind === "pump" ? "Pump" : "Fan");

/** A number typed into a cell: written on Enter or when the cell loses focus, Escape puts the value back. */
function NumberCell({ value, label, disabled, onCommit }: { value: number; label: string; disabled: boolean; onCommit: (v: number) => void }) {
  const commit = (input: HTMLInputElement) => {
    const v = Number(input.value.trim().replace(",", "."));
    if (input.value.trim() === "" || !Number.isFinite(v)) input.value = fmt(value);
    else if (v !== value) onCommit(v);
  };
  const onKeyDown = (e: KeyboardEvent<HTMLInputElement>) => {
    if (e.key === "Enter") commit(e.currentTarget);
    if (e.key === "Escape") e.currentTarget.value = fmt(value);
  };
  return (
    <input
      // A new value from the text (or the plot) resets the cell.
      key={value}
      defaultValue={fmt(value)}
      inputMode="decimal"
      aria-label={label}
      disabled={disabled}
      onBlur={(e) => commit(e.currentTarget)}
      onKeyDown={onKeyDown}
      className="w-20 rounded border border-ink-300 px-1.5 py-0.5 text-right tabular-nums focus:border-copper-500 focus:outline-none focus:ring-2 focus:ring-copper-200 disabled:bg-transparent disabled:border-transparent"
    />
  );
}

/** One point's row: its numbers are props, so an edit re-renders only the rows it changed. */
const PointRow = memo(function PointRow({ kind, index, tempC, dutyPct, rpm, soundDbA, editing }: { kind: CurveKind; index: number; tempC: number; dutyPct: number; rpm: number; soundDbA: number; editing: CurveEditing | null }) {
  return (
    <tr className="border-t border-ink-100">
      <td className="py-1 pr-2 tabular-nums text-ink-600">{index + 1}</td>
      <td className="py-1 pr-2">
        <NumberCell value={tempC} label={`${noun(kind)} point ${index + 1} temperature (°C)`} disabled={!editing} onCommit={(v) => editing?.movePoint(kind, index, { tempC: v }, true)} />
      </td>
      <td className="py-1 pr-2">
        <NumberCell value={dutyPct} label={`${noun(kind)} point ${index + 1} duty (%)`} disabled={!editing} onCommit={(v) => editing?.movePoint(kind, index, { dutyPct: v }, true)} />
      </td>
      <td className="py-1 pr-2 text-right tabular-nums">{Math.round(rpm)}</td>
      <td className="py-1 pr-2 text-right tabular-nums">{Number.isFinite(soundDbA) ? soundDbA.toFixed(1) : "—"}</td>
      <td className="py-1 text-right">
        {editing && (
          <button type="button" className="rounded px-1.5 text-ink-600 hover:bg-ink-100 hover:text-signal-fault" aria-label={`Remove ${noun(kind).toLowerCase()} point ${index + 1}`} onClick={() => editing.removePoint(kind, index)}>
            ×
          </button>
        )}
      </td>
    </tr>
  );
});

/** The curve points as a table (temperature, duty, RPM, level), edited in step with the text and the plot. */
function PointsTable({ profile, hw, editing }: { profile: CoolingProfile; hw: HardwareContext; editing: CurveEditing | null }) {
  const tables = useMemo(() => (["pump", "fans"] as const).map((kind) => ({ kind, rows: pointRows(profile, hw, kind) })), [profile, hw]);
  return (
    <div className="space-y-4" data-testid="points-table">
      {tables.map(({ kind, rows }) => (
        <div key={kind}>
          <table className="w-full text-sm">
            <caption className="mb-1 text-left font-medium text-ink-800">{noun(kind)} points{kind === "fans" ? ` (${hw.fanCount} fans together)` : ""}</caption>
            <thead>
              <tr className="text-left text-xs text-ink-600">
                <th scope="col" className="py-1 pr-2">#</th>
                <th scope="col" className="py-1 pr-2">°C</th>
                <th scope="col" className="py-1 pr-2">Duty %</th>
                <th scope="col" className="py-1 pr-2 text-right">RPM</th>
                <th scope="col" className="py-1 pr-2 text-right">dB(A) 1 m</th>
                <th scope="col" className="py-1"><span className="sr-only">Remove</span></th>
              </tr>
            </thead>
            <tbody>
              {rows.map((r, i) => (
                <PointRow key={i} kind={kind} index={i} tempC={r.tempC} dutyPct={r.dutyPct} rpm={r.rpm} soundDbA={r.soundDbA} editing={editing} />
              ))}
            </tbody>
          </table>
          {editing && (
            <Button variant="secondary" className="mt-2" onClick={() => editing.addPoint(kind)}>
              Add {noun(kind).toLowerCase()} point
            </Button>
          )}
        </div>
      ))}
    </div>
  );
}

export default memo(PointsTable);
