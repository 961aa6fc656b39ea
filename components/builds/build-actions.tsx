"use client";

import { useState } from "react";
import { apiCall } from "@/lib/api/client";
import { transitionBuild, type BuildDetail, type TransitionBody } from "@/lib/api/operations/builds";
import { can, type Role } from "@/lib/auth/roles";
import { STAGE_LABELS } from "@/lib/release/stages";
import { capabilityFor, nextStage, WITHDRAWABLE } from "@/lib/release/transitions";
import { Button } from "@/components/ui/button";
import { Field, Textarea } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";
import { ErrorNotice } from "@/components/ui/error-notice";
import { useBuildMutation } from "./use-build";

const PROMOTE_LABEL: Record<string, string> = {
  review: "Ask for review",
  validation: "Promote to lab validation",
  pilot: "Promote to pilot run",
  production: "Release to the factory",
};

export function BuildActions({ detail, role }: { detail: BuildDetail; role: Role }) {
  const { build } = detail;
  const [notes, setNotes] = useState("");
  const [reason, setReason] = useState("");
  const move = useBuildMutation(build.id, (body: TransitionBody) => apiCall(transitionBuild, { params: { id: build.id }, body }));
  const next = nextStage(build.stage);
  const canPromote = next !== null && can(role, capabilityFor(next));
  const canWithdraw = WITHDRAWABLE.includes(build.stage) && can(role, "build:withdraw");
  if (!canPromote && !canWithdraw) return null;

  return (
    <Panel title="Next step">
      <div className="space-y-4">
        {canPromote && next && (
          <form
            className="space-y-2"
            onSubmit={(e) => {
              e.preventDefault();
              move.mutate({ from: build.stage, to: next, ...(next === "production" ? { releaseNotes: notes } : {}) });
            }}
          >
            {next === "validation" && (
              <p className="text-sm text-ink-700">
                Approvals: {detail.approvals.counting} of {detail.approvals.required} needed
                {detail.approvals.openChangeRequests > 0 && `, ${detail.approvals.openChangeRequests} open change request(s)`}.
              </p>
            )}
            {next === "production" && (
              <Field id="releaseNotes" label="Release notes" hint="What the factory and support should know about this build.">
                <Textarea id="releaseNotes" rows={3} value={notes} onChange={(e) => setNotes(e.target.value)} aria-describedby="releaseNotes-hint" />
              </Field>
            )}
            <Button type="submit" disabled={move.isPending}>{PROMOTE_LABEL[next] ?? `Move to ${STAGE_LABELS[next]}`}</Button>
          </form>
        )}
        {canWithdraw && (
          <form
            className="space-y-2 border-t border-ink-200 pt-3"
            onSubmit={(e) => {
              e.preventDefault();
              move.mutate({ from: build.stage, to: "withdrawn", reason });
            }}
          >
            <Field id="withdrawReason" label="Reason for withdrawing" hint="Support sees this beside every board that shipped with the build.">
              <Textarea id="withdrawReason" rows={2} value={reason} onChange={(e) => setReason(e.target.value)} aria-describedby="withdrawReason-hint" />
            </Field>
            <Button type="submit" variant="danger" disabled={move.isPending}>Withdraw build</Button>
          </form>
        )}
        <ErrorNotice error={move.error} />
      </div>
    </Panel>
  );
}
