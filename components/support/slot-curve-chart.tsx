"use client";

import { CartesianGrid, Legend, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { evaluateCurves } from "@/lib/engine";
import { toHardwareContext } from "@/lib/registry/hardware-context";
import type { LookupResult, LookupSlot } from "@/lib/api/operations/support";

/** Pump and fan RPM against liquid temperature for one shipped slot, on the board's revision. Loaded lazily. */
export default function SlotCurveChart({ slot, revision }: { slot: LookupSlot; revision: LookupResult["boardRevision"] }) {
  const hw = toHardwareContext({ cooler: slot.cooler, fan: slot.fan, pump: slot.pump, revision });
  const rows = evaluateCurves(slot.document, hw, { fromC: 20, toC: 70, stepC: 1 });
  return (
    <figure aria-label={`${slot.profileName} ${slot.version}: pump and fan speed against liquid temperature`}>
      <div className="h-56 w-full">
        <ResponsiveContainer>
          <LineChart data={rows} margin={{ top: 8, right: 16, bottom: 8, left: 8 }}>
            <CartesianGrid stroke="#e4e1dc" strokeDasharray="3 3" />
            <XAxis dataKey="tempC" type="number" domain={[20, 70]} unit=" °C" tick={{ fontSize: 12 }} />
            <YAxis yAxisId="rpm" tick={{ fontSize: 12 }} width={56} unit="" label={{ value: "RPM", angle: -90, position: "insideLeft", fontSize: 12 }} />
            <Tooltip formatter={(v) => (typeof v === "number" ? Math.round(v).toLocaleString("en") : String(v))} labelFormatter={(t) => `${typeof t === "number" || typeof t === "string" ? t : ""} °C liquid`} />
            <Legend />
            <Line yAxisId="rpm" type="monotone" dataKey="pumpRpm" name="Pump RPM" stroke="#1d6fa3" dot={false} strokeWidth={2} isAnimationActive={false} />
            <Line yAxisId="rpm" type="monotone" dataKey="fanRpm" name="Fan RPM" stroke="#b2562a" dot={false} strokeWidth={2} isAnimationActive={false} />
          </LineChart>
        </ResponsiveContainer>
      </div>
      <figcaption className="mt-1 text-xs text-ink-600">
        {slot.cooler.name}: {slot.cooler.fanCount} × {slot.fan.name}, {slot.pump.name}. Steady-state estimate from the stored curve.
      </figcaption>
    </figure>
  );
}
