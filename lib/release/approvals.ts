/** A review as the gate into validation sees it. */
export interface ReviewFacts {
  reviewerUserId: string;
  verdict: "approve" | "request_changes";
  resolvedAt: Date | string | null;
}

/**
 * Approvals that count: one per reviewer, from people who wrote neither the build nor any
 * of its profile versions (four-eyes rule).
 */
export function countingApprovers(reviews: readonly ReviewFacts[], excludedUserIds: ReadonlySet<string>): string[] {
  const ids = new Set<string>();
  for (const r of reviews) if (r.verdict === "approve" && !excludedUserIds.has(r.reviewerUserId)) ids.add(r.reviewerUserId);
  return [...ids];
}

export function openChangeRequests(reviews: readonly ReviewFacts[]): number {
  return reviews.filter((r) => r.verdict === "request_changes" && !r.resolvedAt).length;
}

/** The reasons the gate into validation is closed; empty when it is open. */
export function approvalGateIssues(reviews: readonly ReviewFacts[], excludedUserIds: ReadonlySet<string>, required: number): string[] {
  const issues: string[] = [];
  const n = countingApprovers(reviews, excludedUserIds).length;
  if (n < required) issues.push(`The build has ${n} of ${required} required approvals from people who wrote neither the build nor its profile versions.`);
  const open = openChangeRequests(reviews);
  if (open > 0) issues.push(`${open} change request${open === 1 ? " is" : "s are"} still open; the author must resolve ${open === 1 ? "it" : "them"} first.`);
  return issues;
}
