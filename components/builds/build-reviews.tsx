"use client";

import { useState } from "react";
import { apiCall } from "@/lib/api/client";
import { changeReview, resolveReview, reviewBuild } from "@/lib/api/endpoints";
import type { BuildDetail, BuildGateView, ReviewBody } from "@/lib/api/operations/builds";
import { can, type Role } from "@/lib/auth/roles";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { Field, Textarea } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";
import { ErrorNotice } from "@/components/ui/error-notice";
import { useBuildMutation } from "./use-build";
import { formatUtc } from "@/lib/time/format";

/**
 * The build's reviews, each saying whether it counts toward the approvals and why not;
 * Approve and Request changes only for someone the server would let review the build now.
 */
export function BuildReviews({ detail, gate, viewer }: { detail: BuildDetail; gate: BuildGateView | undefined; viewer: { userId: string; role: Role } }) {
  const { build } = detail;
  const [comment, setComment] = useState("");
  const own = gate?.review.ownReviewId ?? null;
  const review = useBuildMutation(build.id, (body: ReviewBody) =>
    own ? apiCall(changeReview, { params: { id: build.id, reviewId: own }, body }) : apiCall(reviewBuild, { params: { id: build.id }, body }),
  );
  const resolve = useBuildMutation(build.id, (reviewId: string) => apiCall(resolveReview, { params: { id: build.id, reviewId } }));
  const isAuthor = build.authorUserId === viewer.userId;
  const mayReview = gate?.review.mayReview ?? false;
  const send = (verdict: ReviewBody["verdict"]) => review.mutate({ verdict, comment }, { onSuccess: () => setComment("") });

  return (
    <Panel title={`Reviews (${detail.approvals.counting} of ${detail.approvals.required} approvals)`}>
      {detail.reviews.length === 0 ? (
        <p className="text-sm text-ink-600">No reviews yet.</p>
      ) : (
        <ul className="space-y-2 text-sm" aria-label="Reviews">
          {detail.reviews.map((r) => (
            <li key={r.id} className="rounded border border-ink-200 p-2">
              <div className="flex flex-wrap items-center gap-2">
                <span className="font-medium">{r.reviewerName}</span>
                {r.verdict === "approve" ? (
                  <Badge tone={r.standing.counts ? "ok" : "neutral"}>approved</Badge>
                ) : (
                  <Badge tone={r.resolvedAt ? "neutral" : "warn"}>{r.resolvedAt ? "changes resolved" : "changes requested"}</Badge>
                )}
                <span className="text-xs text-ink-500">{formatUtc(r.updatedAt)}</span>
                {isAuthor && r.verdict === "request_changes" && !r.resolvedAt && (
                  <Button variant="secondary" className="ml-auto" onClick={() => resolve.mutate(r.id)}>Mark resolved</Button>
                )}
              </div>
              {r.verdict === "approve" && (
                <p className={`mt-1 text-xs ${r.standing.counts ? "text-signal-ok" : "text-signal-warn"}`} data-testid="review-standing">
                  {r.standing.counts ? "Counts toward the approvals." : `Does not count: ${r.standing.reason ?? "not an eligible reviewer."}`}
                </p>
              )}
              {r.comment && <p className="mt-1 text-ink-700">{r.comment}</p>}
            </li>
          ))}
        </ul>
      )}
      {mayReview && (
        <div className="mt-3 space-y-2 border-t border-ink-200 pt-3">
          {own && <p className="text-sm text-ink-700">You {gate?.review.ownVerdict === "approve" ? "approved" : "requested changes"}; sending again changes your verdict.</p>}
          <Field id="reviewComment" label="Comment" hint="Required when you request changes.">
            <Textarea id="reviewComment" rows={2} value={comment} onChange={(e) => setComment(e.target.value)} aria-describedby="reviewComment-hint" />
          </Field>
          <div className="flex gap-2">
            <Button onClick={() => send("approve")} disabled={review.isPending}>Approve</Button>
            <Button variant="secondary" onClick={() => send("request_changes")} disabled={review.isPending}>Request changes</Button>
          </div>
        </div>
      )}
      {!mayReview && build.stage === "review" && can(viewer.role, "build:review") && gate?.review.reason && (
        <p className="mt-3 border-t border-ink-200 pt-3 text-sm text-ink-600" data-testid="review-refusal">{gate.review.reason}</p>
      )}
      <div className="mt-2 space-y-2">
        <ErrorNotice error={review.error} />
        <ErrorNotice error={resolve.error} />
      </div>
    </Panel>
  );
}
