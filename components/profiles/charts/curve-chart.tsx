"use client";

import { memo } from "react";
import { CartesianGrid, Legend, Line, LineChart, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import type { PlotRow } from "@/lib/registry/editor-evaluation";

export interface MotorLimits {
  fanMinRpm: number;
  fanMaxRpm: number;
  pumpMinRpm: number;
  pumpMaxRpm: number;
}

/** Pump and fan RPM against liquid temperature, authored and as flashed, with sound on a second axis. */
function CurveChart({ rows, limits, criticalTempC }: { rows: PlotRow[]; limits: MotorLimits; criticalTempC: number | undefined }) {
  return (
    <figure aria-label="Pump and fan speed and estimated sound against liquid temperature" data-testid="curve-chart" data-rows={rows.length} data-first-pump-rpm={rows[0]?.pumpRpm ?? ""} data-fan-rpm-40c={rows.find((r) => r.tempC === 40)?.fanRpm ?? ""}>
      <ResponsiveContainer width="100%" height={320}>
        <LineChart data={rows} margin={{ top: 8, right: 16, bottom: 16, left: 8 }}>
          <CartesianGrid stroke="#e5e7eb" />
          <XAxis dataKey="tempC" type="number" domain={["dataMin", "dataMax"]} unit=" °C" label={{ value: "Liquid temperature (°C)", position: "insideBottom", offset: -8 }} />
          <YAxis yAxisId="rpm" unit="" label={{ value: "RPM", angle: -90, position: "insideLeft" }} />
          <YAxis yAxisId="db" orientation="right" domain={[0, "auto"]} label={{ value: "dB(A) at 1 m", angle: 90, position: "insideRight" }} />
          <Tooltip />
          <Legend verticalAlign="top" />
          <Line yAxisId="rpm" dataKey="pumpRpm" name="Pump RPM" stroke="#0e7490" dot={false} isAnimationActive={false} />
          <Line yAxisId="rpm" dataKey="pumpRpmFlashed" name="Pump RPM as flashed" stroke="#0e7490" strokeDasharray="4 3" dot={false} isAnimationActive={false} />
          <Line yAxisId="rpm" dataKey="fanRpm" name="Fan RPM" stroke="#b45309" dot={false} isAnimationActive={false} />
          <Line yAxisId="rpm" dataKey="fanRpmFlashed" name="Fan RPM as flashed" stroke="#b45309" strokeDasharray="4 3" dot={false} isAnimationActive={false} />
          <Line yAxisId="db" dataKey="soundDbA" name="Sound dB(A), estimate" stroke="#4b5563" strokeWidth={1} dot={false} isAnimationActive={false} />
          <ReferenceLine yAxisId="rpm" y={limits.fanMaxRpm} stroke="#b45309" strokeOpacity={0.5} label={{ value: "fan max", fontSize: 11, position: "insideTopLeft" }} />
          <ReferenceLine yAxisId="rpm" y={limits.fanMinRpm} stroke="#b45309" strokeOpacity={0.5} label={{ value: "fan min", fontSize: 11, position: "insideBottomLeft" }} />
          <ReferenceLine yAxisId="rpm" y={limits.pumpMaxRpm} stroke="#0e7490" strokeOpacity={0.5} label={{ value: "pump max", fontSize: 11, position: "insideTopRight" }} />
          <ReferenceLine yAxisId="rpm" y={limits.pumpMinRpm} stroke="#0e7490" strokeOpacity={0.5} label={{ value: "pump min", fontSize: 11, position: "insideBottomRight" }} />
          {criticalTempC !== undefined && (
            <ReferenceLine yAxisId="rpm" x={criticalTempC} stroke="#b42318" strokeDasharray="6 3" label={{ value: `critical ${criticalTempC} °C`, fontSize: 11, position: "top" }} />
          )}
        </LineChart>
      </ResponsiveContainer>
    </figure>
  );
}

// Re-drawn only when its rows or limits change, not on every render of the editor around it.
export default memo(CurveChart);
