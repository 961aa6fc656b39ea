"use client";

import { flushSync } from "react-dom";
import { memo, useCallback, useEffect, useLayoutEffect, useMemo, useRef, useState, type PointerEvent as ReactPointerEvent } from "react";
import type { CoolingProfile, CurveKind, HardwareContext } from "@/lib/engine";
import type { PlotRow } from "@/lib/registry/editor-evaluation";
import { TEMP_STEP_C } from "@/lib/bank/layout";
import { snapToStep } from "@/lib/curve-edit";
import type { CurveEditing } from "../editor/use-curve-editing";
import { bandPath, dutyToHandleRpm, evenTicks, handleRpmToDuty, linePath, linearScale, placeLimitLabels, type DutyAxis, type LinearScale } from "./plot-geometry";
import { CurveHandles, type DragStart } from "./curve-handles";
import { PLOT_COLOURS as C, PlotLegend } from "./plot-legend";

export interface MotorLimits {
  fanMinRpm: number;
  fanMaxRpm: number;
  pumpMinRpm: number;
  pumpMaxRpm: number;
}

/** The settled state for the chosen heat load, marked on the plot. */
export interface OperatingMark {
  liquidTempC: number;
  fanRpm: number;
}

// The legend changes only with the fan stop's presence, not with every edit.
const Legend = memo(PlotLegend);

const HEIGHT = 340;
const M = { top: 22, right: 52, bottom: 38, left: 60 };

/** Follows the width of its container (the plot re-lays out, it is not stretched). */
function useWidth(): [React.RefObject<HTMLDivElement | null>, number] {
  const ref = useRef<HTMLDivElement | null>(null);
  const [width, setWidth] = useState(640);
  useEffect(() => {
    const el = ref.current;
    if (!el) return;
    const observer = new ResizeObserver(([entry]) => {
      const w = Math.round(entry?.contentRect.width ?? 0);
      if (w > 0) setWidth(w);
    });
    observer.observe(el);
    return () => observer.disconnect();
  }, []);
  return [ref, width];
}

interface Props {
  rows: PlotRow[];
  limits: MotorLimits;
  profile: CoolingProfile | undefined;
  flashed: CoolingProfile | undefined;
  hw: HardwareContext;
  operating: OperatingMark | null;
  /** Null when the viewer may not edit: the points are drawn, not offered as handles. */
  editing: CurveEditing | null;
}

/** Grid, ticks and axis titles: the same from one keystroke to the next, so React skips them. */
const PlotFrame = memo(function PlotFrame({
  x,
  y,
  yDb,
  xTicks,
  rpmTicks,
  dbTicks,
  width,
  plotW,
  plotH,
}: {
  x: LinearScale;
  y: LinearScale;
  yDb: LinearScale;
  xTicks: number[];
  rpmTicks: number[];
  dbTicks: number[];
  width: number;
  plotW: number;
  plotH: number;
}) {
  const plotRight = M.left + plotW;
  return (
    <>
      {xTicks.map((t) => (
        <g key={`x${t}`}>
          <line x1={x(t)} x2={x(t)} y1={M.top} y2={M.top + plotH} stroke={C.grid} />
          <text x={x(t)} y={M.top + plotH + 14} textAnchor="middle" fontSize={11} fill={C.axis}>{t}</text>
        </g>
      ))}
      {rpmTicks.map((t) => (
        <g key={`y${t}`}>
          <line x1={M.left} x2={plotRight} y1={y(t)} y2={y(t)} stroke={C.grid} />
          <text x={M.left - 6} y={y(t) + 4} textAnchor="end" fontSize={11} fill={C.axis}>{t}</text>
        </g>
      ))}
      {dbTicks.map((t) => (
        <text key={`db${t}`} x={plotRight + 6} y={yDb(t) + 4} fontSize={11} fill={C.axis}>{t}</text>
      ))}
      <text x={M.left + plotW / 2} y={HEIGHT - 6} textAnchor="middle" fontSize={12} fill={C.axis}>Liquid temperature (°C)</text>
      <text transform={`translate(14 ${M.top + plotH / 2}) rotate(-90)`} textAnchor="middle" fontSize={12} fill={C.axis}>RPM</text>
      <text transform={`translate(${width - 8} ${M.top + plotH / 2}) rotate(90)`} textAnchor="middle" fontSize={12} fill={C.axis}>dB(A) at 1 m</text>
    </>
  );
});

/**
 * The live editor plot: pump and fan RPM (authored solid, as flashed dashed), their
 * hysteresis bands, the estimated sound on a second axis, motor limits, critical and
 * fan-stop temperatures, the operating point, and a handle on every curve point.
 * Plain SVG drawn by React: a keystroke changes a few `d` attributes, nothing more.
 */
function LiveCurvePlot({ rows, limits, profile, flashed, hw, operating, editing }: Props) {
  const [boxRef, width] = useWidth();
  const svgRef = useRef<SVGSVGElement | null>(null);
  const drag = useRef<DragStart | null>(null);
  // Where the plot is on the page during a drag, read once when the press lands: reading it on
  // every move would force a layout of whatever the last commit (the table, the operating panel
  // in the background pass) changed, before the move's own work, and the frame would lay out
  // again after it. A scroll, a new width or the page changing height (a notice above) reads it again.
  const dragBox = useRef<DOMRect | null>(null);
  const plotW = Math.max(200, width - M.left - M.right);
  const plotH = HEIGHT - M.top - M.bottom;

  const fromC = rows[0]?.tempC ?? 20;
  const toC = rows[rows.length - 1]?.tempC ?? 70;
  const x = useMemo(() => linearScale([fromC, toC], [M.left, M.left + plotW]), [fromC, toC, plotW]);
  const xTicks = useMemo(() => evenTicks(fromC, toC, Math.max(4, Math.round(plotW / 70))).ticks.filter((t) => t >= fromC && t <= toC), [fromC, toC, plotW]);
  const rpmAxis = useMemo(() => evenTicks(0, Math.max(limits.fanMaxRpm, limits.pumpMaxRpm) * 1.05, 6), [limits.fanMaxRpm, limits.pumpMaxRpm]);
  const y = useMemo(() => linearScale(rpmAxis.domain, [M.top + plotH, M.top]), [rpmAxis, plotH]);
  let loudest = 0;
  for (const r of rows) if (r.soundDbA > loudest) loudest = r.soundDbA;
  const dbAxis = useMemo(() => evenTicks(0, Math.max(10, Math.ceil(loudest / 10) * 10 + 5), 5), [loudest]);
  const yDb = useMemo(() => linearScale(dbAxis.domain, [M.top + plotH, M.top]), [dbAxis, plotH]);

  // Pixel series: each `d` string only changes when its own series changed.
  const xs = rows.map((r) => x(r.tempC));
  const series = {
    pump: linePath(xs, rows.map((r) => y(r.pumpRpm))),
    pumpFlashed: linePath(xs, rows.map((r) => y(r.pumpRpmFlashed))),
    pumpBand: bandPath(xs, rows.map((r) => y(r.pumpRpm)), rows.map((r) => y(r.pumpRpmFalling))),
    fan: linePath(xs, rows.map((r) => y(r.fanRpm))),
    fanFlashed: linePath(xs, rows.map((r) => y(r.fanRpmFlashed))),
    fanBand: bandPath(xs, rows.map((r) => y(r.fanRpm)), rows.map((r) => y(r.fanRpmFalling))),
    sound: linePath(xs, rows.map((r) => yDb(r.soundDbA))),
  };

  const limitLines = [
    { id: "fan max", rpm: limits.fanMaxRpm, colour: C.fan },
    { id: "fan min", rpm: limits.fanMinRpm, colour: C.fan },
    { id: "pump max", rpm: limits.pumpMaxRpm, colour: C.pump },
    { id: "pump min", rpm: limits.pumpMinRpm, colour: C.pump },
  ];
  const labelWidthPx = 64;
  const curveYsAt = (side: "left" | "right") => {
    const from = side === "left" ? M.left : M.left + plotW - labelWidthPx;
    const out: number[] = [];
    rows.forEach((r, i) => {
      if (xs[i]! < from || xs[i]! > from + labelWidthPx) return;
      out.push(y(r.pumpRpm), y(r.fanRpm), yDb(r.soundDbA));
    });
    return out;
  };
  const labels = placeLimitLabels(limitLines.map((l) => ({ id: l.id, y: y(l.rpm) })), curveYsAt);

  const motors = useMemo<Record<CurveKind, DutyAxis>>(() => ({ pump: hw.pump, fans: hw.fan }), [hw.pump, hw.fan]);
  // Stable callbacks for the point handles (memoised: only the handles that moved re-render).
  const editingNow = useRef(editing);
  useLayoutEffect(() => {
    editingNow.current = editing;
  }, [editing]);
  const onDragStart = useCallback((start: DragStart, e: ReactPointerEvent<SVGElement>) => {
    drag.current = start;
    dragBox.current = svgRef.current?.getBoundingClientRect() ?? null;
    svgRef.current?.setPointerCapture(e.pointerId);
    editingNow.current?.beginGesture();
  }, []);
  useEffect(() => {
    const forget = () => {
      dragBox.current = null;
    };
    forget();
    const page = new ResizeObserver(forget);
    page.observe(document.body);
    window.addEventListener("scroll", forget, { capture: true, passive: true });
    return () => {
      page.disconnect();
      window.removeEventListener("scroll", forget, { capture: true });
    };
  }, [width]);
  const dutyToY = useCallback((kind: CurveKind, duty: number) => y(dutyToHandleRpm(duty, motors[kind])), [y, motors]);
  const toData = (e: { clientX: number; clientY: number }, box: DOMRect | null | undefined = svgRef.current?.getBoundingClientRect()) => {
    if (!box) return null;
    return { tempC: x.invert(e.clientX - box.left), rpm: y.invert(e.clientY - box.top) };
  };

  const onPointerMove = (e: ReactPointerEvent<SVGSVGElement>) => {
    const d = drag.current;
    if (!d || !editing) return;
    dragBox.current ??= svgRef.current?.getBoundingClientRect() ?? null;
    const at = toData(e, dragBox.current);
    if (!at) return;
    performance.mark("lk-drag", { startTime: e.timeStamp });
    const target = d.target;
    // The browser delivers pointer moves at the start of a frame. Committed at once (not in the
    // scheduler's next task, as React does for a continuous event), the step is drawn in the same
    // frame as the move that caused it, one frame sooner.
    flushSync(() => {
      if (target.type === "point") {
        const duty = handleRpmToDuty(at.rpm, motors[target.kind]);
        editing.movePoint(target.kind, target.index, { tempC: snapToStep(at.tempC, TEMP_STEP_C), dutyPct: snapToStep(duty, 0.5) }, false);
      } else if (target.type === "fanStop") {
        editing.setValue(target, snapToStep(at.tempC, TEMP_STEP_C), false);
      } else {
        // The band handle sits on the falling branch, hysteresis °C left of its anchor point.
        editing.setValue(target, snapToStep(d.anchorTempC - at.tempC, 0.1), false);
      }
    });
  };
  const endDrag = () => {
    if (!drag.current) return;
    drag.current = null;
    dragBox.current = null;
    editing?.endGesture();
  };
  const onDoubleClick = (e: React.MouseEvent<SVGSVGElement>) => {
    if (!editing || !profile || (e.target as Element).closest("[data-handle]")) return;
    const at = toData(e);
    if (!at || at.tempC < fromC || at.tempC > toC) return;
    // The curve nearer to the pointer gets the point.
    const i = Math.round((at.tempC - fromC) / ((toC - fromC) / Math.max(1, rows.length - 1)));
    const row = rows[Math.min(rows.length - 1, Math.max(0, i))];
    if (!row) return;
    const kind: CurveKind = Math.abs(row.pumpRpm - at.rpm) < Math.abs(row.fanRpm - at.rpm) ? "pump" : "fans";
    editing.addPoint(kind, at.tempC);
  };

  const critical = profile?.criticalTempC;
  const stop = profile?.fans.stopBelowTempC;
  const plotRight = M.left + plotW;
  return (
    <figure
      aria-label="Pump and fan speed and estimated sound against liquid temperature"
      data-testid="curve-chart"
      data-rows={rows.length}
      data-first-pump-rpm={rows[0]?.pumpRpm ?? ""}
      data-fan-rpm-40c={rows.find((r) => r.tempC === 40)?.fanRpm ?? ""}
    >
      <Legend hasStop={stop !== undefined} />
      <div ref={boxRef} className="w-full">
        <svg
          ref={svgRef}
          width={width}
          height={HEIGHT}
          role="group"
          aria-label={editing ? "Curve plot: each point is a slider; arrow keys move it by 0.5 (Shift: 5), Delete removes it, double-click the plot to add one" : "Curve plot"}
          className="touch-none select-none"
          onPointerMove={onPointerMove}
          onPointerUp={endDrag}
          onPointerCancel={endDrag}
          onDoubleClick={onDoubleClick}
        >
          <g aria-hidden="true">
            <PlotFrame x={x} y={y} yDb={yDb} xTicks={xTicks} rpmTicks={rpmAxis.ticks} dbTicks={dbAxis.ticks} width={width} plotW={plotW} plotH={plotH} />

            <path d={series.pumpBand} fill={C.pump} fillOpacity={0.12} data-series="pump-hysteresis" />
            <path d={series.fanBand} fill={C.fan} fillOpacity={0.12} data-series="fan-hysteresis" />
            {limitLines.map((l) => (
              <line key={l.id} x1={M.left} x2={plotRight} y1={y(l.rpm)} y2={y(l.rpm)} stroke={l.colour} strokeOpacity={0.45} />
            ))}
            {labels.map((l) => (
              <text key={l.id} data-label={l.id} x={l.side === "left" ? M.left + 4 : plotRight - 4} y={l.y} textAnchor={l.side === "left" ? "start" : "end"} fontSize={11} fill={C.axis} stroke="white" strokeWidth={3} paintOrder="stroke">
                {l.id}
              </text>
            ))}
            <path d={series.sound} fill="none" stroke={C.sound} strokeWidth={1} data-series="sound" />
            <path d={series.pumpFlashed} fill="none" stroke={C.pump} strokeWidth={1.5} strokeDasharray={C.flashedDash} data-series="pump-flashed" />
            <path d={series.fanFlashed} fill="none" stroke={C.fan} strokeWidth={1.5} strokeDasharray={C.flashedDash} data-series="fan-flashed" />
            <path d={series.pump} fill="none" stroke={C.pump} strokeWidth={2} data-series="pump" />
            <path d={series.fan} fill="none" stroke={C.fan} strokeWidth={2} data-series="fan" />
            {critical !== undefined && critical >= fromC && critical <= toC && (
              <g data-testid="critical-line">
                <line x1={x(critical)} x2={x(critical)} y1={M.top} y2={M.top + plotH} stroke={C.critical} strokeDasharray={C.criticalDash} />
                <text x={x(critical)} y={M.top - 6} textAnchor={x(critical) > plotRight - 50 ? "end" : "middle"} fontSize={11} fill={C.critical}>critical {critical} °C</text>
              </g>
            )}
            {operating && operating.liquidTempC >= fromC && operating.liquidTempC <= toC && (
              <g data-testid="operating-mark">
                <line x1={x(operating.liquidTempC)} x2={x(operating.liquidTempC)} y1={M.top} y2={M.top + plotH} stroke={C.operating} strokeDasharray="1 3" />
                <circle cx={x(operating.liquidTempC)} cy={y(operating.fanRpm)} r={5} fill="none" stroke={C.operating} strokeWidth={2} />
              </g>
            )}
          </g>
          {profile && (
            <CurveHandles
              profile={profile}
              flashed={flashed}
              x={x}
              fromC={fromC}
              toC={toC}
              bottom={M.top + plotH}
              editing={editing}
              onDragStart={onDragStart}
              dutyToY={dutyToY}
            />
          )}
        </svg>
      </div>
    </figure>
  );
}

export default memo(LiveCurvePlot);
