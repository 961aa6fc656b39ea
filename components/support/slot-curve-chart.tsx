"use client";

import { Area, CartesianGrid, ComposedChart, Legend, Line, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { evaluateCurves } from "@/lib/evaluation/curve-table";
import { coolingBranchRpm } from "@/lib/registry/cooling-branch";
import { toHardwareContext } from "@/lib/registry/hardware-context";
import type { LookupResult, LookupSlot } from "@/lib/api/operations/support";
import { evenTicks } from "@/components/profiles/charts/plot-geometry";
import { PLOT_COLOURS as C } from "@/components/profiles/charts/plot-legend";

/** Pump and fan RPM against liquid temperature for one shipped slot, on the board's revision, with hysteresis bands and the critical temperature. Loaded lazily. */
export default function SlotCurveChart({ slot, revision }: { slot: LookupSlot; revision: LookupResult["boardRevision"] }) {
  const hw = toHardwareContext({ cooler: slot.cooler, fan: slot.fan, pump: slot.pump, revision });
  const doc = slot.document;
  const rows = evaluateCurves(doc, hw, { fromC: 20, toC: 70, stepC: 1 }).map((r) => ({
    ...r,
    pumpBand: [coolingBranchRpm(doc, hw, "pump", r.tempC), r.pumpRpm] as [number, number],
    fanBand: [coolingBranchRpm(doc, hw, "fans", r.tempC), r.fanRpm] as [number, number],
  }));
  const x = evenTicks(20, 70, 5);
  const critical = doc.criticalTempC;
  return (
    <figure aria-label={`${slot.profileName} ${slot.version}: pump and fan speed against liquid temperature`}>
      <div className="h-64 w-full">
        <ResponsiveContainer>
          <ComposedChart data={rows} margin={{ top: 8, right: 16, bottom: 8, left: 8 }}>
            <CartesianGrid stroke="#e4e1dc" strokeDasharray="3 3" />
            <XAxis dataKey="tempC" type="number" domain={x.domain} ticks={x.ticks} interval={0} unit=" °C" tick={{ fontSize: 12 }} />
            <YAxis yAxisId="rpm" tick={{ fontSize: 12 }} width={56} unit="" label={{ value: "RPM", angle: -90, position: "insideLeft", fontSize: 12 }} />
            <Tooltip
              formatter={(v) => (typeof v === "number" ? Math.round(v).toLocaleString("en") : Array.isArray(v) ? v.map((n) => Math.round(Number(n)).toLocaleString("en")).join("–") : String(v))}
              labelFormatter={(t) => `${typeof t === "number" || typeof t === "string" ? t : ""} °C liquid`}
            />
            <Legend verticalAlign="bottom" />
            <Area yAxisId="rpm" dataKey="pumpBand" name="Pump hysteresis band" stroke="none" fill={C.pump} fillOpacity={0.12} legendType="square" isAnimationActive={false} />
            <Area yAxisId="rpm" dataKey="fanBand" name="Fan hysteresis band" stroke="none" fill={C.fan} fillOpacity={0.12} legendType="square" isAnimationActive={false} />
            <Line yAxisId="rpm" type="linear" dataKey="pumpRpm" name="Pump RPM" stroke={C.pump} legendType="plainline" dot={false} strokeWidth={2} isAnimationActive={false} />
            <Line yAxisId="rpm" type="linear" dataKey="fanRpm" name="Fan RPM" stroke={C.fan} legendType="plainline" dot={false} strokeWidth={2} isAnimationActive={false} />
            {critical >= 20 && critical <= 70 && (
              <ReferenceLine yAxisId="rpm" x={critical} stroke={C.critical} strokeDasharray={C.criticalDash} label={{ value: `critical ${critical} °C`, fontSize: 11, fill: C.critical, position: "insideTopRight" }} />
            )}
          </ComposedChart>
        </ResponsiveContainer>
      </div>
      <figcaption className="mt-1 text-xs text-ink-600">
        {slot.cooler.name}: {slot.cooler.fanCount} × {slot.fan.name}, {slot.pump.name}. Steady-state estimate from the stored curve; the shaded band is where the speed sits while the liquid cools (hysteresis).
      </figcaption>
    </figure>
  );
}
