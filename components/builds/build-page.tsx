"use client";

import Link from "next/link";
import type { Role } from "@/lib/auth/roles";
import { STAGE_LABELS } from "@/lib/release/stages";
import { EstimateCaution, Notice } from "@/components/ui/notice";
import { PageHeader, Panel } from "@/components/ui/panel";
import { Table, Td, Th } from "@/components/ui/table";
import { BuildActions } from "./build-actions";
import { BuildEvidence } from "./build-evidence";
import { BuildReviews } from "./build-reviews";
import { StageBadge } from "@/components/ui/stage-badge";
import { useBuild, useBuildGate } from "./use-build";
import { ErrorNotice } from "@/components/ui/error-notice";

import { hex32 } from "@/lib/hex/address";
import { profileVersionHref } from "@/lib/audit/describe";
import { formatUtc } from "@/lib/time/format";

export function BuildPage({ id, viewer }: { id: string; viewer: { userId: string; role: Role } }) {
  const q = useBuild(id);
  const gate = useBuildGate(id);
  if (q.isPending) return <div aria-busy className="h-40 animate-pulse rounded-md bg-white shadow-panel" />;
  if (q.isError) {
    return (
      <ErrorNotice error={q.error} onRetry={() => void q.refetch()} />
    );
  }
  const detail = q.data;
  const { build } = detail;
  // Revisions with different base addresses need their own HEX file.
  const hexRevisions = detail.revisions.filter((r, i, all) => all.findIndex((o) => o.baseAddress === r.baseAddress) === i);

  return (
    <>
      <PageHeader
        title={
          <span className="flex flex-wrap items-center gap-3">
            {build.boardModel} {build.version} <StageBadge stage={build.stage} />
          </span>
        }
        subtitle={`Board revisions ${build.revisionRange} (${detail.revisions.map((r) => r.revision).join(", ") || "none"}) · created by ${build.authorName} on ${build.createdAt.slice(0, 10)}`}
      />
      <div className="space-y-4">
        {build.stage === "withdrawn" && <Notice tone="fault" role="alert" title="This build was withdrawn">{build.withdrawnReason}</Notice>}
        {build.releaseNotes && <Notice tone="ok" title="Release notes">{build.releaseNotes}</Notice>}
        <EstimateCaution />
        <div className="grid gap-4 lg:grid-cols-3">
          <div className="space-y-4 lg:col-span-2">
            <Panel title="Bank image">
              <dl className="grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1 text-sm">
                <dt className="text-ink-600">Size</dt>
                <dd className="tabular-nums" data-testid="bank-bytes">{build.bankBytes ?? "—"} bytes (smallest memory in range: {Math.min(...detail.revisions.map((r) => r.memoryBytes))} bytes)</dd>
                <dt className="text-ink-600">CRC-32 trailer</dt>
                <dd className="font-mono">{build.bankCrc32 !== null ? hex32(build.bankCrc32) : "—"}</dd>
                <dt className="text-ink-600">SHA-256 (.bin)</dt>
                <dd className="break-all font-mono text-xs" data-testid="bank-sha256">{build.bankSha256 ?? "—"}</dd>
                <dt className="text-ink-600">Ed25519 signature</dt>
                <dd data-testid="bank-signature">{build.bankSignatureKeyId ? <>signed by key <code className="text-xs">{build.bankSignatureKeyId}</code></> : "not signed yet (signed when the build enters pilot)"}</dd>
              </dl>
              <div className="mt-3 flex flex-wrap gap-2 text-sm">
                <a href={`/api/v1/builds/${build.id}/bank?format=bin`} download>Download .bin</a>
                {build.bankSignatureKeyId && <a href={`/api/v1/builds/${build.id}/bank?format=sig`} download>Download .sig</a>}
                {hexRevisions.map((r) => (
                  <a key={r.revision} href={`/api/v1/builds/${build.id}/bank?format=hex&revision=${encodeURIComponent(r.revision)}`} download>
                    Download .hex at {hex32(r.baseAddress)} (revision {r.revision})
                  </a>
                ))}
                <a href={`/api/v1/builds/${build.id}/vectors`} download title="Stored codes, duty over a temperature sweep and per-tick traces the board's firmware must reproduce (docs/firmware-vectors.md)">
                  Download firmware test vectors
                </a>
              </div>
            </Panel>
            <Panel title="Slots">
              <Table caption="Profile versions in the bank">
                <thead>
                  <tr>
                    <Th>Slot</Th>
                    <Th>Profile</Th>
                    <Th>Cooler</Th>
                    <Th>Version</Th>
                    <Th>Boards</Th>
                    <Th>Content hash</Th>
                  </tr>
                </thead>
                <tbody>
                  {detail.slots.map((s) => (
                    <tr key={s.slotIndex}>
                      <Td className="tabular-nums">{s.slotIndex + 1}</Td>
                      <Td className="font-medium">
                        <Link className="text-copper-700 underline" href={profileVersionHref(s.profileId, s.version)}>{s.profileName} {s.version}</Link>
                      </Td>
                      <Td>{s.coolerModel}</Td>
                      <Td className="tabular-nums">{s.version}</Td>
                      <Td><code className="text-xs">{s.boardRange}</code></Td>
                      <Td><code className="text-xs">{s.contentHash.slice(0, 16)}</code></Td>
                    </tr>
                  ))}
                </tbody>
              </Table>
            </Panel>
            <BuildEvidence detail={detail} role={viewer.role} />
          </div>
          <div className="space-y-4">
            <BuildActions detail={detail} gate={gate.data} role={viewer.role} />
            {gate.isError && <ErrorNotice error={gate.error} onRetry={() => void gate.refetch()} />}
            <BuildReviews detail={detail} gate={gate.data} viewer={viewer} />
            <Panel title="Stage timeline">
              <ol className="space-y-2 text-sm" aria-label="Stage timeline" data-testid="timeline">
                <li>
                  <span className="font-medium">Created</span> <span className="text-xs text-ink-500">{formatUtc(build.createdAt)}</span>
                </li>
                {detail.transitions.map((t) => (
                  <li key={t.id}>
                    <span className="font-medium">{STAGE_LABELS[t.toStage]}</span> · {t.actorName}{" "}
                    <span className="text-xs text-ink-500">{formatUtc(t.createdAt)}</span>
                    {t.reason && <p className="text-xs text-ink-700">{t.reason}</p>}
                  </li>
                ))}
              </ol>
            </Panel>
          </div>
        </div>
      </div>
    </>
  );
}
