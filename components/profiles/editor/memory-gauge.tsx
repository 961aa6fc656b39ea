import { memoryUse } from "@/lib/registry/editor-evaluation";
import type { CoolingProfile } from "@/lib/engine";

/** Bank image bytes of this profile against each board revision's profile memory. */
export function MemoryGauge({ profile, revisions, boardRange }: { profile: CoolingProfile; revisions: { revision: string; memoryBytes: number }[]; boardRange: string | null }) {
  const rows = memoryUse(profile, boardRange, revisions);
  return (
    <ul className="space-y-2 text-sm" aria-label="Memory use per board revision">
      {rows.map((r) => {
        const pct = Math.min(100, (r.imageBytes / r.memoryBytes) * 100);
        return (
          <li key={r.revision}>
            <div className="flex justify-between">
              <span className="font-medium">Revision {r.revision}</span>
              <span className={`tabular-nums ${r.fits ? "text-ink-700" : "font-semibold text-signal-fault"}`}>
                {r.imageBytes} / {r.memoryBytes} B {r.fits ? "" : "— does not fit"}
                {r.compatible && !r.compatible.ok && r.fits ? " — outside the range" : ""}
              </span>
            </div>
            <div className="mt-1 h-2 rounded bg-ink-100" role="meter" aria-valuemin={0} aria-valuemax={r.memoryBytes} aria-valuenow={r.imageBytes} aria-label={`Revision ${r.revision} memory`}>
              <div className={`h-2 rounded ${r.fits ? "bg-coolant-500" : "bg-signal-fault"}`} style={{ width: `${pct}%` }} />
            </div>
          </li>
        );
      })}
    </ul>
  );
}
