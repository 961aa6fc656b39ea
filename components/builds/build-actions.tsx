"use client";

import { useState } from "react";
import { apiCall } from "@/lib/api/client";
import { transitionBuild } from "@/lib/api/endpoints";
import type { BuildDetail, BuildGateView, TransitionBody } from "@/lib/api/operations/builds";
import { can, type Role } from "@/lib/auth/roles";
import { STAGE_LABELS } from "@/lib/release/stages";
import { capabilityFor } from "@/lib/release/transitions";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { ConfirmDialog } from "@/components/ui/confirm-dialog";
import { Field, Textarea } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { Panel } from "@/components/ui/panel";
import { ErrorNotice } from "@/components/ui/error-notice";
import { useBuildMutation } from "./use-build";

const PROMOTE_LABEL: Record<string, string> = {
  review: "Ask for review",
  validation: "Promote to lab validation",
  pilot: "Promote to pilot run",
  production: "Release to the factory…",
};

type Requirement = NonNullable<BuildGateView["next"]>["requirements"][number];

const STATE_BADGE: Record<Requirement["state"], { tone: "ok" | "warn" | "neutral"; text: string }> = {
  met: { tone: "ok", text: "done" },
  unmet: { tone: "warn", text: "still needed" },
  on_promotion: { tone: "neutral", text: "with the promotion" },
};

/** The next stage's requirements, each with its state and what it still needs. */
function GateChecklist({ next }: { next: NonNullable<BuildGateView["next"]> }) {
  const to = STAGE_LABELS[next.to].toLowerCase();
  return (
    <ul className="space-y-2 text-sm" aria-label={`Checklist for ${to}`} data-testid="gate-checklist">
      {next.requirements.map((r) => (
        <li key={r.key} className="flex gap-2" data-state={r.state}>
          <span aria-hidden className={`mt-0.5 w-4 shrink-0 text-center font-bold ${r.state === "met" ? "text-signal-ok" : r.state === "unmet" ? "text-signal-warn" : "text-ink-500"}`}>
            {r.state === "met" ? "✓" : r.state === "unmet" ? "✗" : "…"}
          </span>
          <span>
            <span className="font-medium">{r.label}</span> <Badge tone={STATE_BADGE[r.state].tone}>{STATE_BADGE[r.state].text}</Badge>
            <span className="block text-xs text-ink-600">{r.detail}</span>
          </span>
        </li>
      ))}
    </ul>
  );
}

/**
 * The checklist of the next stage (from the server's gate), the promote button (enabled
 * only when every requirement holds), and withdraw behind its own confirmation.
 */
export function BuildActions({ detail, gate, role }: { detail: BuildDetail; gate: BuildGateView | undefined; role: Role }) {
  const { build } = detail;
  const title = `${build.boardModel} ${build.version}`;
  const [notes, setNotes] = useState("");
  const [reason, setReason] = useState("");
  const [dialog, setDialog] = useState<"release" | "withdraw" | null>(null);
  const move = useBuildMutation(build.id, (body: TransitionBody) => apiCall(transitionBuild, { params: { id: build.id }, body }));
  const next = gate?.next ?? null;
  const canPromote = next !== null && can(role, capabilityFor(next.to));
  const canWithdraw = gate?.mayWithdraw ?? false;
  const close = () => {
    setDialog(null);
    move.reset();
  };
  const submit = (body: TransitionBody) => move.mutate(body, { onSuccess: () => setDialog(null) });

  return (
    <Panel title={next ? `Next: ${STAGE_LABELS[next.to]}` : "Next step"}>
      <div className="space-y-4">
        {!gate && <div aria-busy className="h-16 animate-pulse rounded bg-ink-50" />}
        {gate && !next && <p className="text-sm text-ink-600">{build.stage === "withdrawn" ? "A withdrawn build goes no further." : "The build is released to the factory; no stage follows."}</p>}
        {next && <GateChecklist next={next} />}
        {next && canPromote && (
          <div className="space-y-1">
            <Button
              disabled={!next.ready || move.isPending}
              aria-describedby={next.ready ? undefined : "promote-blocked"}
              onClick={() => (next.to === "production" ? setDialog("release") : move.mutate({ from: build.stage, to: next.to }))}
            >
              {PROMOTE_LABEL[next.to] ?? `Move to ${STAGE_LABELS[next.to]}`}
            </Button>
            {!next.ready && (
              <p id="promote-blocked" className="text-xs text-ink-600">
                Enabled once every item above is done.
              </p>
            )}
          </div>
        )}
        {dialog === null && <ErrorNotice error={move.error} />}
        {canWithdraw && (
          <div className="border-t border-ink-200 pt-3">
            <Button variant="secondary" className="text-signal-fault" onClick={() => setDialog("withdraw")}>
              Withdraw build…
            </Button>
          </div>
        )}
      </div>

      <ConfirmDialog
        open={dialog === "release"}
        title={`Release build ${title} to the factory?`}
        description={
          <>
            <p>
              Build {title} moves from the pilot run to factory release: production stations flash its bank image onto new {build.boardModel} boards of revisions {build.revisionRange}, and
              release managers and support are told by mail.
            </p>
            <p>This cannot be undone. If the build turns out bad, it can only be withdrawn, and boards already shipped keep it.</p>
            <Notice tone="warn" title="Estimates are not measurements">Lab validation, the maker&apos;s safety process and local rules govern the release, not these checks.</Notice>
          </>
        }
        confirmLabel="Release to the factory"
        variant="primary"
        pending={move.isPending}
        confirmDisabled={!notes.trim()}
        onClose={close}
        onConfirm={() => submit({ from: build.stage, to: "production", releaseNotes: notes })}
      >
        <Field id="releaseNotes" label="Release notes" hint="What the factory and support should know about this build. Required.">
          <Textarea id="releaseNotes" rows={3} value={notes} onChange={(e) => setNotes(e.target.value)} aria-describedby="releaseNotes-hint" />
        </Field>
        <ErrorNotice error={move.error} />
      </ConfirmDialog>

      <ConfirmDialog
        open={dialog === "withdraw"}
        title={`Withdraw build ${title}?`}
        description={
          <p>
            Build {title} leaves {STAGE_LABELS[build.stage].toLowerCase()} for good: it can never be promoted again, support sees your reason beside every board that shipped with it, and release
            managers and support are told by mail. This cannot be undone.
          </p>
        }
        confirmLabel="Withdraw build"
        pending={move.isPending}
        confirmDisabled={!reason.trim()}
        onClose={close}
        onConfirm={() => submit({ from: build.stage, to: "withdrawn", reason })}
      >
        <Field id="withdrawReason" label="Reason for withdrawing" hint="Support sees this beside every board that shipped with the build. Required.">
          <Textarea id="withdrawReason" rows={2} value={reason} onChange={(e) => setReason(e.target.value)} aria-describedby="withdrawReason-hint" />
        </Field>
        <ErrorNotice error={move.error} />
      </ConfirmDialog>
    </Panel>
  );
}
