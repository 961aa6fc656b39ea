import type { ReactNode } from "react";

const tones = {
  neutral: "bg-ink-100 text-ink-700 ring-ink-300",
  accent: "bg-copper-50 text-copper-700 ring-copper-200",
  info: "bg-coolant-50 text-coolant-700 ring-coolant-300",
  ok: "bg-signal-okBg text-signal-ok ring-signal-ok/30",
  warn: "bg-signal-warnBg text-signal-warn ring-signal-warn/30",
  fault: "bg-signal-faultBg text-signal-fault ring-signal-fault/30",
} as const;

export type BadgeTone = keyof typeof tones;

export function Badge({ tone = "neutral", children }: { tone?: BadgeTone; children: ReactNode }) {
  return <span className={`inline-flex items-center rounded px-1.5 py-0.5 text-xs font-medium ring-1 ring-inset ${tones[tone]}`}>{children}</span>;
}
