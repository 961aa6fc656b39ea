"use client";

import { CartesianGrid, Legend, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import type { MeasurementComparison } from "@/lib/release/measurements";

/** Measured and estimated sound at the lab's operating points, against liquid temperature. */
export default function SoundPlot({ rows }: { rows: MeasurementComparison[] }) {
  const data = [...rows]
    .sort((a, b) => a.liquidTempC - b.liquidTempC)
    .map((r) => ({ tempC: r.liquidTempC, measured: r.soundDbA, corrected: r.correctedDbA === null ? null : Number(r.correctedDbA.toFixed(1)), estimated: Number.isFinite(r.estimatedDbA) ? Number(r.estimatedDbA.toFixed(1)) : null }));
  return (
    <figure aria-label="Measured against estimated sound level" data-testid="sound-plot">
      <div className="h-64 w-full">
        <ResponsiveContainer>
          <LineChart data={data} margin={{ top: 8, right: 16, bottom: 16, left: 0 }}>
            <CartesianGrid stroke="#dbd8d0" />
            <XAxis dataKey="tempC" type="number" domain={["dataMin", "dataMax"]} unit=" °C" label={{ value: "Liquid temperature", position: "insideBottom", offset: -8 }} />
            <YAxis unit=" dB" domain={["auto", "auto"]} width={60} />
            <Tooltip />
            <Legend verticalAlign="top" />
            <Line name="Measured dB(A)" dataKey="measured" stroke="#b5612f" strokeWidth={2} dot={{ r: 4 }} isAnimationActive={false} />
            <Line name="Corrected for background dB(A)" dataKey="corrected" stroke="#6b5b2f" strokeWidth={2} dot={{ r: 3 }} connectNulls={false} isAnimationActive={false} />
            <Line name="Estimated dB(A)" dataKey="estimated" stroke="#2f7195" strokeDasharray="5 4" strokeWidth={2} dot={{ r: 3 }} isAnimationActive={false} />
          </LineChart>
        </ResponsiveContainer>
      </div>
      <figcaption className="sr-only">Measured, background-corrected and estimated sound level at each measured liquid temperature; points too close to the background have no corrected value.</figcaption>
    </figure>
  );
}
