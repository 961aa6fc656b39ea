/** Colours and dash patterns of the curve plots, shared by the SVG and its legend. */
export const PLOT_COLOURS = {
  pump: "#0e7490",
  fan: "#b45309",
  sound: "#4b5563",
  critical: "#b42318",
  operating: "#6d28d9",
  grid: "#e5e7eb",
  axis: "#4b5563",
  flashedDash: "5 3",
  criticalDash: "6 3",
  stopDash: "2 3",
} as const;

const C = PLOT_COLOURS;

function Swatch({ stroke, dash, band, width = 2 }: { stroke: string; dash?: string; band?: boolean; width?: number }) {
  return (
    <svg width="28" height="12" aria-hidden="true" className="shrink-0">
      {band ? <rect x="1" y="2" width="26" height="8" fill={stroke} fillOpacity={0.18} /> : <line x1="1" x2="27" y1="6" y2="6" stroke={stroke} strokeWidth={width} strokeDasharray={dash} />}
    </svg>
  );
}

/** The plot's legend as HTML above the drawing: each entry drawn in its series' own stroke and dash. */
export function PlotLegend({ hasStop }: { hasStop: boolean }) {
  const items = [
    { label: "Pump RPM", swatch: <Swatch stroke={C.pump} /> },
    { label: "Pump as flashed", swatch: <Swatch stroke={C.pump} dash={C.flashedDash} width={1.5} /> },
    { label: "Fan RPM", swatch: <Swatch stroke={C.fan} /> },
    { label: "Fan as flashed", swatch: <Swatch stroke={C.fan} dash={C.flashedDash} width={1.5} /> },
    { label: "Hysteresis band (cooling)", swatch: <Swatch stroke={C.fan} band /> },
    { label: "Sound dB(A), estimate", swatch: <Swatch stroke={C.sound} width={1} /> },
    { label: "Critical temperature", swatch: <Swatch stroke={C.critical} dash={C.criticalDash} width={1} /> },
    ...(hasStop ? [{ label: "Fan stop", swatch: <Swatch stroke={C.fan} dash={C.stopDash} width={1.5} /> }] : []),
  ];
  return (
    <ul className="mb-1 flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-700" aria-label="Legend">
      {items.map((i) => (
        <li key={i.label} className="flex items-center gap-1.5">
          {i.swatch}
          {i.label}
        </li>
      ))}
    </ul>
  );
}
