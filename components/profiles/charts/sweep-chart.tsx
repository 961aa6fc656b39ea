"use client";

import { CartesianGrid, Legend, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";

export interface SweepRow {
  heatLoadW: number;
  liquidTempC: number;
  soundDbA: number;
}

/** Settled liquid temperature and estimated sound over a range of heat loads. */
export default function SweepChart({ rows }: { rows: SweepRow[] }) {
  return (
    <figure aria-label="Liquid temperature and sound against heat load">
      <ResponsiveContainer width="100%" height={240}>
        <LineChart data={rows} margin={{ top: 8, right: 16, bottom: 16, left: 8 }}>
          <CartesianGrid stroke="#e5e7eb" />
          <XAxis dataKey="heatLoadW" type="number" domain={["dataMin", "dataMax"]} label={{ value: "Heat load (W)", position: "insideBottom", offset: -8 }} />
          <YAxis yAxisId="c" label={{ value: "°C", angle: -90, position: "insideLeft" }} />
          <YAxis yAxisId="db" orientation="right" label={{ value: "dB(A)", angle: 90, position: "insideRight" }} />
          <Tooltip />
          <Legend verticalAlign="top" />
          <Line yAxisId="c" dataKey="liquidTempC" name="Liquid °C" stroke="#b42318" dot={false} isAnimationActive={false} />
          <Line yAxisId="db" dataKey="soundDbA" name="Sound dB(A), estimate" stroke="#4b5563" dot={false} isAnimationActive={false} />
        </LineChart>
      </ResponsiveContainer>
    </figure>
  );
}
