"use client";

import { Area, CartesianGrid, ComposedChart, Legend, Line, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { evenTicks } from "./plot-geometry";
import { PLOT_COLOURS as C } from "./plot-legend";

export interface CompareRow {
  tempC: number;
  pumpA?: number;
  fanA?: number;
  pumpB?: number;
  fanB?: number;
  /** The newer version's cooling branch: [speed while cooling, speed while warming]. */
  pumpBandB?: [number, number];
  fanBandB?: [number, number];
}

/** Two versions' pump and fan curves on one plot, with the newer one's hysteresis bands and both critical temperatures. */
export default function CompareChart({ rows, labelA, labelB, criticalA, criticalB }: { rows: CompareRow[]; labelA: string; labelB: string; criticalA?: number; criticalB?: number }) {
  const from = rows[0]?.tempC ?? 20;
  const to = rows[rows.length - 1]?.tempC ?? 70;
  const x = evenTicks(from, to, 5);
  const criticals = criticalA !== undefined && criticalA === criticalB ? [{ c: criticalA, label: `critical ${criticalA} °C`, dash: C.criticalDash }] : [
    ...(criticalA !== undefined ? [{ c: criticalA, label: `critical ${labelA}: ${criticalA} °C`, dash: "2 3" }] : []),
    ...(criticalB !== undefined ? [{ c: criticalB, label: `critical ${labelB}: ${criticalB} °C`, dash: C.criticalDash }] : []),
  ];
  return (
    <figure aria-label={`Curves of ${labelA} and ${labelB} overlaid`} data-testid="compare-chart" data-x-ticks={x.ticks.join(",")}>
      <ResponsiveContainer width="100%" height={340}>
        <ComposedChart data={rows} margin={{ top: 8, right: 16, bottom: 16, left: 8 }}>
          <CartesianGrid stroke={C.grid} />
          <XAxis dataKey="tempC" type="number" domain={x.domain} ticks={x.ticks} interval={0} label={{ value: "Liquid temperature (°C)", position: "insideBottom", offset: -8 }} />
          <YAxis label={{ value: "RPM", angle: -90, position: "insideLeft" }} />
          <Tooltip />
          {/* Below the plot, so labels drawn at the plot's top never sit on it; plain lines show each series' dash. */}
          <Legend verticalAlign="bottom" wrapperStyle={{ paddingTop: 16 }} />
          <Area dataKey="pumpBandB" name={`Pump hysteresis ${labelB}`} stroke="none" fill={C.pump} fillOpacity={0.12} legendType="square" isAnimationActive={false} />
          <Area dataKey="fanBandB" name={`Fan hysteresis ${labelB}`} stroke="none" fill={C.fan} fillOpacity={0.12} legendType="square" isAnimationActive={false} />
          <Line dataKey="pumpA" name={`Pump ${labelA}`} stroke={C.pump} strokeDasharray={C.flashedDash} legendType="plainline" dot={false} isAnimationActive={false} />
          <Line dataKey="fanA" name={`Fans ${labelA}`} stroke={C.fan} strokeDasharray={C.flashedDash} legendType="plainline" dot={false} isAnimationActive={false} />
          <Line dataKey="pumpB" name={`Pump ${labelB}`} stroke={C.pump} legendType="plainline" dot={false} isAnimationActive={false} />
          <Line dataKey="fanB" name={`Fans ${labelB}`} stroke={C.fan} legendType="plainline" dot={false} isAnimationActive={false} />
          {criticals.map((k, i) => (
            <ReferenceLine key={k.label} x={k.c} stroke={C.critical} strokeDasharray={k.dash} label={{ value: k.label, fontSize: 11, fill: C.critical, position: i === 0 ? "insideTopRight" : "insideTopLeft" }} />
          ))}
        </ComposedChart>
      </ResponsiveContainer>
    </figure>
  );
}
