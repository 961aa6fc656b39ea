"use client";

import { useId, useState } from "react";
// From its own module, not the engine's index: the index would bring the whole engine into the lookup page.
import { realRpmFromReading } from "@/lib/tach/tach";
import { DEFAULT_PUMP_PULSES_PER_REV } from "@/lib/support/pump-pulses";
import { checkPumpSpeed } from "@/lib/support/tach-check";
import { Field, Input } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";

/**
 * What a customer's reading means: hosts count 2 tach pulses per revolution (the
 * 4-wire fan standard), so a motor giving p pulses shows reading = real × p / 2.
 */
export function TachConverter({ pulsesPerRev, pumpName, pumpRange }: { pulsesPerRev?: number; pumpName?: string | null; pumpRange?: { rpmAtMinDuty: number; maxRpm: number } }) {
  const id = useId();
  const [reading, setReading] = useState("5600");
  const [pulses, setPulses] = useState(String(pulsesPerRev ?? DEFAULT_PUMP_PULSES_PER_REV));
  const readingNum = Number(reading);
  const pulsesNum = Number(pulses);
  const valid = reading.trim() !== "" && Number.isFinite(readingNum) && readingNum >= 0 && Number.isInteger(pulsesNum) && pulsesNum >= 1 && pulsesNum <= 8;
  const realRpm = valid ? realRpmFromReading(readingNum, pulsesNum) : null;
  const finding = realRpm !== null && pumpRange ? checkPumpSpeed(realRpm, pumpRange, pulsesNum) : null;
  return (
    <Panel title="Tach converter">
      <div className="grid gap-3 sm:grid-cols-3">
        <Field id={`${id}-reading`} label="Reading the customer sees (RPM)" hint="As shown by the motherboard or monitoring tool.">
          <Input id={`${id}-reading`} inputMode="decimal" value={reading} onChange={(e) => setReading(e.target.value)} aria-describedby={`${id}-reading-hint`} />
        </Field>
        <Field
          id={`${id}-pulses`}
          label="Motor pulses per revolution"
          hint={pulsesPerRev ? `From the registry${pumpName ? ` (${pumpName})` : ""}.` : `Pumps commonly give ${DEFAULT_PUMP_PULSES_PER_REV} (common practice, no published standard).`}
        >
          <Input id={`${id}-pulses`} inputMode="numeric" value={pulses} onChange={(e) => setPulses(e.target.value)} aria-describedby={`${id}-pulses-hint`} />
        </Field>
        <div aria-live="polite">
          <p className="text-sm font-medium text-ink-800">Real speed</p>
          {valid ? (
            <p className="mt-1 text-2xl font-semibold tabular-nums text-coolant-700" data-testid="tach-real-rpm">
              {Math.round(realRpm ?? 0).toLocaleString("en")} RPM
            </p>
          ) : (
            <p className="mt-1 text-sm text-signal-fault">Enter a reading of 0 or more and a whole number of pulses from 1 to 8.</p>
          )}
          {finding && finding.kind !== "ok" && (
            <p className="mt-1 text-sm font-medium text-signal-warn" role="status" data-testid="tach-finding">{finding.message}</p>
          )}
          {pumpRange && (
            <p className="mt-1 text-xs text-ink-600">
              This pump runs {pumpRange.rpmAtMinDuty.toLocaleString("en")}–{pumpRange.maxRpm.toLocaleString("en")} RPM by its datasheet.
            </p>
          )}
          <p className="mt-1 text-xs text-ink-600">Hosts count 2 pulses per revolution; real = reading × 2 ÷ pulses.</p>
        </div>
      </div>
    </Panel>
  );
}
