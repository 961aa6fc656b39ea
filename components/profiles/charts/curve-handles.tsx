"use client";

import { memo, useState, type KeyboardEvent, type PointerEvent as ReactPointerEvent } from "react";
import { pointValueText } from "@/lib/curve-edit";
import type { CoolingProfile, CurveKind } from "@/lib/engine";
import { targetKey, type CurveEditing, type EditTarget } from "../editor/use-curve-editing";
import type { LinearScale } from "./plot-geometry";
import { PLOT_COLOURS as C } from "./plot-legend";

/** What a drag moves, and for the hysteresis handle the point it hangs from. */
export interface DragStart {
  target: EditTarget;
  anchorTempC: number;
}

const KINDS: readonly CurveKind[] = ["pump", "fans"];
const colour = (kind: CurveKind) => (kind === "pump" ? C.pump : C.fan);
const fmt = (n: number) => String(Math.round(n * 1000) / 1000);

/** Arrow keys: ±0.5 per press, ±5 with Shift (the board's 0.5 °C / 0.5 % steps). */
function keyStep(e: KeyboardEvent, small: number, large: number): { dx: number; dy: number } | null {
  const step = e.shiftKey ? large : small;
  switch (e.key) {
    case "ArrowUp":
      return { dx: 0, dy: step };
    case "ArrowDown":
      return { dx: 0, dy: -step };
    case "ArrowRight":
      return { dx: step, dy: 0 };
    case "ArrowLeft":
      return { dx: -step, dy: 0 };
    case "PageUp":
      return { dx: 0, dy: large };
    case "PageDown":
      return { dx: 0, dy: -large };
    default:
      return null;
  }
}

interface Props {
  profile: CoolingProfile;
  flashed: CoolingProfile | undefined;
  x: LinearScale;
  fromC: number;
  toC: number;
  bottom: number;
  editing: CurveEditing | null;
  onDragStart: (start: DragStart, e: ReactPointerEvent<SVGElement>) => void;
  dutyToY: (kind: CurveKind, dutyPct: number) => number;
}

/** Why the last edit of a handle stopped short, beside it (left of it near the plot's right edge). */
function Reason({ text, cx, cy, onLeft }: { text: string; cx: number; cy: number; onLeft: boolean }) {
  return (
    <text x={onLeft ? cx - 10 : cx + 10} y={cy - 10} textAnchor={onLeft ? "end" : "start"} fontSize={11} fill={C.critical} stroke="white" strokeWidth={3} paintOrder="stroke" pointerEvents="none" data-testid="handle-reason">
      {text.length > 70 ? `${text.slice(0, 68)}…` : text}
    </text>
  );
}

interface PointHandleProps {
  kind: CurveKind;
  index: number;
  tempC: number;
  dutyPct: number;
  cx: number;
  cy: number;
  /** Where the board stores the point, when that differs and is on the plot. */
  ghostCx: number | null;
  ghostCy: number | null;
  ghostTitle: string | null;
  focused: boolean;
  editing: CurveEditing | null;
  reason: string | null;
  reasonOnLeft: boolean;
  onDragStart: (start: DragStart, e: ReactPointerEvent<SVGElement>) => void;
  setFocused: (update: (f: string | null) => string | null) => void;
}

/**
 * One curve point as a focusable slider. Its props are numbers and stable callbacks, so a
 * keystroke or a drag step re-renders (and writes to the DOM) only the handles that moved.
 */
const PointHandle = memo(function PointHandle({ kind, index, tempC, dutyPct, cx, cy, ghostCx, ghostCy, ghostTitle, focused, editing, reason, reasonOnLeft, onDragStart, setFocused }: PointHandleProps) {
  const key = `${kind}/${index}`;
  const onKeyDown = (e: KeyboardEvent<SVGElement>) => {
    if (!editing) return;
    if (e.key === "Delete" || e.key === "Backspace") {
      e.preventDefault();
      editing.removePoint(kind, index);
      return;
    }
    const step = keyStep(e, 0.5, 5);
    if (!step) return;
    e.preventDefault();
    performance.mark("lk-drag");
    editing.movePoint(kind, index, step.dx !== 0 ? { tempC: tempC + step.dx } : { dutyPct: dutyPct + step.dy }, true);
  };
  const onPointerDown = (e: ReactPointerEvent<SVGElement>) => {
    if (!editing || e.button !== 0) return;
    e.preventDefault();
    e.currentTarget.focus();
    onDragStart({ target: { type: "point", kind, index }, anchorTempC: tempC }, e);
  };
  return (
    <g>
      {ghostCx !== null && ghostCy !== null && (
        <circle cx={ghostCx} cy={ghostCy} r={6} fill="none" stroke={colour(kind)} strokeDasharray="2 2" aria-hidden="true" data-testid="flashed-ghost">
          <title>{ghostTitle}</title>
        </circle>
      )}
      {focused && <circle cx={cx} cy={cy} r={10} fill="none" stroke={C.operating} strokeWidth={2} aria-hidden="true" />}
      {editing ? (
        <circle
          data-handle={key}
          cx={cx}
          cy={cy}
          r={6}
          fill="white"
          stroke={colour(kind)}
          strokeWidth={2.5}
          className="cursor-grab outline-none"
          role="slider"
          tabIndex={0}
          aria-label={`${kind === "pump" ? "pump" : "fan"} point ${index + 1}`}
          aria-valuenow={dutyPct}
          aria-valuemin={0}
          aria-valuemax={100}
          aria-valuetext={pointValueText(kind, index, { tempC, dutyPct })}
          onPointerDown={onPointerDown}
          onKeyDown={onKeyDown}
          onFocus={() => setFocused(() => key)}
          onBlur={() => setFocused((f) => (f === key ? null : f))}
        />
      ) : (
        <circle cx={cx} cy={cy} r={4} fill={colour(kind)} aria-hidden="true" />
      )}
      {reason !== null && <Reason text={reason} cx={cx} cy={cy} onLeft={reasonOnLeft} />}
    </g>
  );
});

/**
 * The points of both curves as focusable sliders, their as-flashed ghosts, the fan
 * stop and the hysteresis handles, and the reason beside a handle that stopped.
 */
export function CurveHandles({ profile, flashed, x, fromC, toC, bottom, editing, onDragStart, dutyToY }: Props) {
  const [focused, setFocused] = useState<string | null>(null);
  const notice = editing?.notice ?? null;
  const inRange = (t: number) => t >= fromC && t <= toC;
  const onLeftAt = (cx: number) => cx > x.range[1] - 220;
  const reasonAt = (key: string, cx: number, cy: number) => (notice?.key === key ? <Reason text={notice.text} cx={cx} cy={cy} onLeft={onLeftAt(cx)} /> : null);
  const startDrag = (target: EditTarget, anchorTempC: number) => (e: ReactPointerEvent<SVGElement>) => {
    if (!editing || e.button !== 0) return;
    e.preventDefault();
    e.currentTarget.focus();
    onDragStart({ target, anchorTempC }, e);
  };

  return (
    <g>
      {KINDS.map((kind) =>
        profile[kind].points.map((p, i) => {
          const key = `${kind}/${i}`;
          const cx = x(p.tempC);
          const q = flashed?.[kind].points[i];
          const ghost = q && (q.tempC !== p.tempC || q.dutyPct !== p.dutyPct) && inRange(q.tempC) ? q : null;
          return (
            <PointHandle
              key={key}
              kind={kind}
              index={i}
              tempC={p.tempC}
              dutyPct={p.dutyPct}
              cx={cx}
              cy={dutyToY(kind, p.dutyPct)}
              ghostCx={ghost ? x(ghost.tempC) : null}
              ghostCy={ghost ? dutyToY(kind, ghost.dutyPct) : null}
              ghostTitle={ghost ? `As flashed: ${fmt(ghost.tempC)} °C, ${fmt(ghost.dutyPct)} %` : null}
              focused={focused === key}
              editing={editing}
              reason={notice?.key === key ? notice.text : null}
              reasonOnLeft={onLeftAt(cx)}
              onDragStart={onDragStart}
              setFocused={setFocused}
            />
          );
        }),
      )}
      {profile.fans.stopBelowTempC !== undefined && inRange(profile.fans.stopBelowTempC) && (
        <FanStop stopC={profile.fans.stopBelowTempC} x={x} bottom={bottom} editing={editing} focused={focused === "fanStop"} setFocused={setFocused} startDrag={startDrag} reasonAt={reasonAt} />
      )}
      {editing &&
        KINDS.map((kind) => {
          const points = profile[kind].points;
          const anchor = points[Math.floor(points.length / 2)];
          if (!anchor) return null;
          const h = profile[kind].hysteresisC;
          const key = targetKey({ type: "hysteresis", kind });
          const cx = x(anchor.tempC - h);
          const cy = dutyToY(kind, anchor.dutyPct);
          return (
            <g key={key}>
              {/* A guide only: it ends on the anchor point's centre, so it must not take that point's presses. */}
              <line x1={cx} x2={x(anchor.tempC)} y1={cy} y2={cy} stroke={colour(kind)} strokeDasharray="1 2" aria-hidden="true" pointerEvents="none" />
              {focused === key && <circle cx={cx} cy={cy} r={10} fill="none" stroke={C.operating} strokeWidth={2} aria-hidden="true" />}
              <rect
                data-handle={key}
                x={cx - 5}
                y={cy - 5}
                width={10}
                height={10}
                transform={`rotate(45 ${cx} ${cy})`}
                fill={colour(kind)}
                fillOpacity={0.35}
                stroke={colour(kind)}
                className="cursor-ew-resize outline-none"
                role="slider"
                tabIndex={0}
                aria-label={`${kind === "pump" ? "pump" : "fan"} hysteresis`}
                aria-valuenow={h}
                aria-valuemin={0}
                aria-valuemax={10}
                aria-valuetext={`${kind === "pump" ? "pump" : "fan"} hysteresis ${fmt(h)} °C`}
                onPointerDown={startDrag({ type: "hysteresis", kind }, anchor.tempC)}
                onKeyDown={(e) => {
                  const step = keyStep(e, 0.1, 1);
                  if (!step) return;
                  e.preventDefault();
                  editing.setValue({ type: "hysteresis", kind }, h + step.dx + step.dy, true);
                }}
                onFocus={() => setFocused(key)}
                onBlur={() => setFocused((f) => (f === key ? null : f))}
              />
              {reasonAt(key, cx, cy)}
            </g>
          );
        })}
    </g>
  );
}

function FanStop({
  stopC,
  x,
  bottom,
  editing,
  focused,
  setFocused,
  startDrag,
  reasonAt,
}: {
  stopC: number;
  x: LinearScale;
  bottom: number;
  editing: CurveEditing | null;
  focused: boolean;
  setFocused: (update: (f: string | null) => string | null) => void;
  startDrag: (target: EditTarget, anchorTempC: number) => (e: ReactPointerEvent<SVGElement>) => void;
  reasonAt: (key: string, cx: number, cy: number) => React.ReactNode;
}) {
  const cx = x(stopC);
  const cy = bottom - 8;
  return (
    <g data-testid="fan-stop">
      {/* Drawn over the curves: marks only, so the points under them stay grabbable. */}
      <line x1={cx} x2={cx} y1={bottom} y2={bottom - 120} stroke={C.fan} strokeDasharray={C.stopDash} strokeWidth={1.5} aria-hidden="true" pointerEvents="none" />
      <text x={cx + 4} y={bottom - 112} fontSize={11} fill={C.fan} stroke="white" strokeWidth={3} paintOrder="stroke" aria-hidden="true" pointerEvents="none">fans stop below {fmt(stopC)} °C</text>
      {focused && <circle cx={cx} cy={cy} r={10} fill="none" stroke={C.operating} strokeWidth={2} aria-hidden="true" />}
      {editing ? (
        <rect
          data-handle="fanStop"
          x={cx - 4}
          y={cy - 8}
          width={8}
          height={16}
          rx={2}
          fill={C.fan}
          className="cursor-ew-resize outline-none"
          role="slider"
          tabIndex={0}
          aria-label="fan stop temperature"
          aria-valuenow={stopC}
          aria-valuemin={0}
          aria-valuemax={100}
          aria-valuetext={`fans stop below ${fmt(stopC)} °C`}
          onPointerDown={startDrag({ type: "fanStop" }, stopC)}
          onKeyDown={(e) => {
            const step = keyStep(e, 0.5, 5);
            if (!step) return;
            e.preventDefault();
            editing.setValue({ type: "fanStop" }, stopC + step.dx + step.dy, true);
          }}
          onFocus={() => setFocused(() => "fanStop")}
          onBlur={() => setFocused((f) => (f === "fanStop" ? null : f))}
        />
      ) : null}
      {reasonAt("fanStop", cx, cy - 14)}
    </g>
  );
}
