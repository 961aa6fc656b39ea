"use client";

import { CartesianGrid, Legend, Line, LineChart, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";

export interface CompareRow {
  tempC: number;
  pumpA?: number;
  fanA?: number;
  pumpB?: number;
  fanB?: number;
}

/** Two versions' pump and fan curves on one plot. */
export default function CompareChart({ rows, labelA, labelB }: { rows: CompareRow[]; labelA: string; labelB: string }) {
  return (
    <figure aria-label={`Curves of ${labelA} and ${labelB} overlaid`} data-testid="compare-chart">
      <ResponsiveContainer width="100%" height={320}>
        <LineChart data={rows} margin={{ top: 8, right: 16, bottom: 16, left: 8 }}>
          <CartesianGrid stroke="#e5e7eb" />
          <XAxis dataKey="tempC" type="number" domain={["dataMin", "dataMax"]} label={{ value: "Liquid temperature (°C)", position: "insideBottom", offset: -8 }} />
          <YAxis label={{ value: "RPM", angle: -90, position: "insideLeft" }} />
          <Tooltip />
          <Legend verticalAlign="top" />
          <Line dataKey="pumpA" name={`Pump ${labelA}`} stroke="#0e7490" strokeDasharray="4 3" dot={false} isAnimationActive={false} />
          <Line dataKey="fanA" name={`Fans ${labelA}`} stroke="#b45309" strokeDasharray="4 3" dot={false} isAnimationActive={false} />
          <Line dataKey="pumpB" name={`Pump ${labelB}`} stroke="#0e7490" dot={false} isAnimationActive={false} />
          <Line dataKey="fanB" name={`Fans ${labelB}`} stroke="#b45309" dot={false} isAnimationActive={false} />
        </LineChart>
      </ResponsiveContainer>
    </figure>
  );
}
