import { can, ROLE_LABELS, type Role } from "../auth/roles";

/** A review as the gate into validation sees it, with its reviewer's account as it is now. */
export interface ReviewFacts {
  reviewerUserId: string;
  verdict: "approve" | "request_changes";
  resolvedAt: Date | string | null;
  /** The reviewer's role now, not when they reviewed: a demoted reviewer's approval stops counting. */
  reviewerRole: Role;
  reviewerDisabledAt: Date | string | null;
}

/** Who may not count as a reviewer of this build: its author and the authors of its profile versions. */
export interface BuildAuthorship {
  buildAuthorUserId: string;
  profileAuthorUserIds: ReadonlySet<string>;
}

export interface ReviewStanding {
  /** Whether this review is an approval the gate into validation counts. */
  counts: boolean;
  /** Why it does not count; null when it does. */
  reason: string | null;
}

/**
 * Whether one review counts toward the approvals a build needs (four-eyes rule): an
 * approval from someone who wrote neither the build nor any of its profile versions,
 * whose account is still active and whose role still allows reviewing. Judged against
 * the account as it is at the moment asked, so the gate at promotion sees the truth.
 */
export function reviewStanding(review: ReviewFacts, authorship: BuildAuthorship): ReviewStanding {
  if (review.verdict !== "approve") return { counts: false, reason: "A change request, not an approval." };
  if (review.reviewerUserId === authorship.buildAuthorUserId) return { counts: false, reason: "The reviewer created this build." };
  if (authorship.profileAuthorUserIds.has(review.reviewerUserId)) return { counts: false, reason: "The reviewer wrote a profile version in this build." };
  if (review.reviewerDisabledAt) return { counts: false, reason: "The reviewer's account is disabled." };
  if (!can(review.reviewerRole, "build:review")) {
    return { counts: false, reason: `The reviewer's role is now ${ROLE_LABELS[review.reviewerRole]}, which may not review builds.` };
  }
  return { counts: true, reason: null };
}

/** Reviewers whose approvals count, one per person. */
export function countingApprovers(reviews: readonly ReviewFacts[], authorship: BuildAuthorship): string[] {
  const ids = new Set<string>();
  for (const r of reviews) if (reviewStanding(r, authorship).counts) ids.add(r.reviewerUserId);
  return [...ids];
}

export function openChangeRequests(reviews: readonly Pick<ReviewFacts, "verdict" | "resolvedAt">[]): number {
  return reviews.filter((r) => r.verdict === "request_changes" && !r.resolvedAt).length;
}

/**
 * Whether `user` may review this build at all (the same rule the server enforces when a
 * review is sent, and the one the build page uses to show Approve only to them).
 */
export function reviewerEligibility(user: { userId: string; role: Role; disabledAt: Date | string | null }, authorship: BuildAuthorship): ReviewStanding {
  return reviewStanding({ reviewerUserId: user.userId, verdict: "approve", resolvedAt: null, reviewerRole: user.role, reviewerDisabledAt: user.disabledAt }, authorship);
}
