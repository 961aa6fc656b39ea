import { memoryUse } from "@/lib/registry/editor-evaluation";
import type { RangeAdmission, RevisionCapacity } from "@/lib/registry/range-fit";
import type { CoolingProfile } from "@/lib/engine";
import { useRangeAdmission } from "./use-range-admission";

function verdict(r: ReturnType<typeof memoryUse>["rows"][number]): { text: string; fault: boolean } {
  if (r.inRange === false) return { text: r.fits ? "outside the range" : `outside the range; could not hold it (${r.reasons.join("; ")})`, fault: false };
  if (!r.fits) return { text: `${r.inRange ? "in the range but " : ""}cannot hold it: ${r.reasons.join("; ")}`, fault: true };
  return { text: r.inRange ? "in the range, holds it" : "holds it", fault: false };
}

/**
 * Bank image bytes of this profile against each board revision's profile memory, judged
 * against the range typed in the publish form by the rule publishing applies, so the two
 * agree before anything is published. `knownRanges`: what the server judged the ranges the
 * screen opens with to admit; any other range loads semver's range matching when first typed.
 */
export function MemoryGauge({ profile, revisions, boardRange, knownRanges }: { profile: CoolingProfile; revisions: readonly RevisionCapacity[]; boardRange: string | null; knownRanges: readonly RangeAdmission[] }) {
  const { admitted, pending } = useRangeAdmission(boardRange, revisions, knownRanges);
  const { rows, rangeProblem } = memoryUse(profile, boardRange, revisions, admitted);
  return (
    <div className="space-y-3">
      <ul className="space-y-2 text-sm" aria-label="Memory use per board revision">
        {rows.map((r) => {
          const pct = Math.min(100, (r.imageBytes / r.memoryBytes) * 100);
          const v = verdict(r);
          return (
            <li key={r.revision} data-testid={`memory-${r.revision}`} data-in-range={r.inRange === null ? undefined : String(r.inRange)} data-fits={String(r.fits)}>
              <div className="flex flex-wrap justify-between gap-x-2">
                <span className="font-medium">Revision {r.revision}</span>
                <span className={`tabular-nums ${v.fault ? "font-semibold text-signal-fault" : "text-ink-700"}`}>
                  {r.imageBytes} / {r.memoryBytes} B — {v.text}
                </span>
              </div>
              <div className="mt-1 h-2 rounded bg-ink-100" role="meter" aria-valuemin={0} aria-valuemax={r.memoryBytes} aria-valuenow={r.imageBytes} aria-label={`Revision ${r.revision} memory`}>
                <div className={`h-2 rounded ${r.fits ? (r.inRange === false ? "bg-ink-300" : "bg-coolant-500") : "bg-signal-fault"}`} style={{ width: `${pct}%` }} />
              </div>
            </li>
          );
        })}
      </ul>
      <p role="status" className={`text-sm ${rangeProblem ? "font-medium text-signal-fault" : "text-ink-600"}`} data-testid="range-fit">
        {boardRange?.trim()
          ? pending
            ? `Checking which revisions "${boardRange.trim()}" admits…`
            : (rangeProblem ?? `Every revision in "${boardRange.trim()}" holds this profile.`)
          : "Type a board revision range under Publish to check it here."}
      </p>
    </div>
  );
}
