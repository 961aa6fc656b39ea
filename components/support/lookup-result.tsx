"use client";

import dynamic from "next/dynamic";
import Link from "next/link";
import type { LookupResult } from "@/lib/api/operations/support";
import { Notice, EstimateCaution } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import { StageBadge } from "@/components/ui/stage-badge";

// recharts is large: load it only when a result with curves is on screen.
const SlotCurveChart = dynamic(() => import("./slot-curve-chart"), {
  ssr: false,
  loading: () => <div className="h-56 animate-pulse rounded bg-ink-100" aria-label="Loading the curve plot" />,
});

const linkClass = "text-copper-700 underline underline-offset-2 hover:text-copper-800";

function Fact({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div>
      <dt className="text-xs font-medium uppercase tracking-wide text-ink-600">{label}</dt>
      <dd className="mt-0.5 text-sm text-ink-900">{children}</dd>
    </div>
  );
}

export function LookupResultView({ result }: { result: LookupResult }) {
  const { lot, build, boardRevision } = result;
  return (
    <div className="space-y-5">
      {build.stage === "withdrawn" && (
        <Notice tone="fault" role="alert" title={`Build ${build.version} was withdrawn`}>
          {build.withdrawnReason ?? "No reason was recorded."}
          {result.newerBuilds[0] ? ` The current production build for this board revision is ${result.newerBuilds[0].version}.` : " No newer production build exists for this board revision yet."}
        </Notice>
      )}
      <Panel title={<span>Serial {result.serial}</span>}>
        <dl className="grid gap-4 sm:grid-cols-3 lg:grid-cols-6">
          <Fact label="Lot"><Link className={linkClass} href={`/lots?code=${encodeURIComponent(lot.lotCode)}`}>{lot.lotCode}</Link></Fact>
          <Fact label="Produced">{lot.producedOn}, {lot.line}</Fact>
          <Fact label="Lot serials">{lot.serialFrom} – {lot.serialTo}</Fact>
          <Fact label="Board revision"><Link className={linkClass} href={`/board-revisions/${boardRevision.id}`}>{boardRevision.revision}</Link> ({boardRevision.memoryBytes} B)</Fact>
          <Fact label="Build"><Link className={linkClass} href={`/builds/${build.id}`}>Build {build.version}</Link></Fact>
          <Fact label="Stage"><StageBadge stage={build.stage} /></Fact>
        </dl>
      </Panel>
      <Panel title="Curves on this board">
        <div className="mb-4"><EstimateCaution /></div>
        {result.slots.length === 0 && <p className="text-sm text-ink-600">This build records no profile slots.</p>}
        <div className="grid gap-6 lg:grid-cols-2">
          {result.slots.map((s) => (
            <section key={s.slotIndex} aria-labelledby={`slot-${s.slotIndex}`}>
              {/* Slots are counted from 1 on every screen; slotIndex stays the 0-based position in the bank. */}
              <h3 id={`slot-${s.slotIndex}`} className="mb-1 text-sm font-semibold text-ink-900">
                Slot {s.slotIndex + 1}:{" "}
                <Link className={linkClass} href={`/profiles/${s.profileId}`} title={`${s.profileName}: its versions and their history`}>
                  {s.profileName} {s.version}
                </Link>
              </h3>
              <SlotCurveChart slot={s} revision={boardRevision} />
            </section>
          ))}
        </div>
      </Panel>
      <Panel title="Newer production builds for this board revision">
        {result.newerBuilds.length === 0 ? (
          <p className="text-sm text-ink-600">None: build {build.version} is the newest production build for revision {boardRevision.revision}.</p>
        ) : (
          <ul className="space-y-4">
            {result.newerBuilds.map((b) => (
              <li key={b.id}>
                <p className="font-medium text-ink-900"><Link className={linkClass} href={`/builds/${b.id}`}>Build {b.version}</Link></p>
                <ul className="mt-1 space-y-1 text-sm">
                  {b.changes.map((c) => (
                    <li key={c.profileId}>
                      <span className="font-medium">{c.profileName}</span>{" "}
                      {c.kind === "added" && <>added ({c.toVersion})</>}
                      {c.kind === "removed" && <>removed (was {c.fromVersion})</>}
                      {c.kind === "unchanged" && <>unchanged ({c.fromVersion})</>}
                      {c.kind === "changed" && (
                        <>
                          {c.fromVersion} → {c.toVersion}
                          {c.changes.length > 0 && <span className="text-ink-700">: {c.changes.join("; ")}</span>}
                        </>
                      )}
                    </li>
                  ))}
                </ul>
              </li>
            ))}
          </ul>
        )}
      </Panel>
    </div>
  );
}
