import type { ReactNode } from "react";

const tones = {
  info: "border-coolant-500 bg-coolant-50 text-coolant-700",
  ok: "border-signal-ok bg-signal-okBg text-signal-ok",
  warn: "border-signal-warn bg-signal-warnBg text-signal-warn",
  fault: "border-signal-fault bg-signal-faultBg text-signal-fault",
} as const;

export function Notice({ tone = "info", title, children, role }: { tone?: keyof typeof tones; title?: ReactNode; children?: ReactNode; role?: "alert" | "status" }) {
  return (
    <div role={role} className={`rounded border-l-4 px-3 py-2 text-sm ${tones[tone]}`}>
      {title && <p className="font-semibold">{title}</p>}
      {children && <div className={title ? "mt-0.5" : ""}>{children}</div>}
    </div>
  );
}

/** The caution shown wherever curves are edited or released. */
export function EstimateCaution() {
  return (
    <Notice tone="warn" title="Estimates, not measurements">
      Speeds, liquid temperatures and sound levels here are computed from datasheet values and simple models. A curve
      still needs lab measurement on real hardware before release; the maker&apos;s product-safety process, the applicable
      equipment-safety standards (e.g. IEC 62368-1) and local rules decide.
    </Notice>
  );
}
