import { can, type Role } from "../auth/roles";
import { countingApprovers, openChangeRequests, type BuildAuthorship, type ReviewFacts } from "./approvals";
import { STAGE_LABELS, type Stage } from "./stages";

/**
 * "met" and "unmet" are facts about the build now; "on_promotion" is something the mover
 * supplies with the promotion itself (release notes), so it does not hold the button back.
 */
export type RequirementState = "met" | "unmet" | "on_promotion";

/** One line of a stage's gate: what is required, whether it holds, and what to do if not. */
export interface GateRequirement {
  key: string;
  label: string;
  state: RequirementState;
  detail: string;
}

/** The unmet requirements' details: the reasons a promotion is refused. */
export function gateIssues(requirements: readonly GateRequirement[]): string[] {
  return requirements.filter((r) => r.state === "unmet").map((r) => r.detail);
}

export const gateOpen = (requirements: readonly GateRequirement[]) => requirements.every((r) => r.state !== "unmet");

const req = (key: string, label: string, met: boolean, detail: string): GateRequirement => ({ key, label, state: met ? "met" : "unmet", detail });

/** Into review: the engine's checks of the bank against every revision in the range. */
export function reviewGate(check: { ok: true; bankBytes: number; revisions: readonly string[] } | { ok: false; issues: readonly string[] }): GateRequirement[] {
  if (check.ok) return [req("bank", "Bank checked on every revision in the range", true, `The ${check.bankBytes}-byte bank fits revisions ${check.revisions.join(", ")}.`)];
  return check.issues.map((issue, i) => req(`bank.${i}`, "Bank checked on every revision in the range", false, issue));
}

/** Into validation: enough counting approvals and no open change request. */
export function validationGate(reviews: readonly ReviewFacts[], authorship: BuildAuthorship, required: number): GateRequirement[] {
  const n = countingApprovers(reviews, authorship).length;
  const open = openChangeRequests(reviews);
  return [
    req(
      "approvals",
      `Approvals ${n} of ${required}`,
      n >= required,
      n >= required
        ? `${n} approvals from eligible reviewers.`
        : `The build has ${n} of ${required} required approvals from active reviewers who wrote neither the build nor its profile versions.`,
    ),
    req(
      "change_requests",
      "No open change request",
      open === 0,
      open === 0 ? "No change request is open." : `${open} change request${open === 1 ? " is" : "s are"} still open; the author must resolve ${open === 1 ? "it" : "them"} first.`,
    ),
  ];
}

/** The reasons the gate into validation is closed; empty when it is open. */
export function approvalGateIssues(reviews: readonly ReviewFacts[], authorship: BuildAuthorship, required: number): string[] {
  return gateIssues(validationGate(reviews, authorship, required));
}

/** What the sound comparison concluded, as the pilot gate needs it. */
export type SoundVerdict =
  | { state: "none" }
  | { state: "invalid"; errors: readonly string[] }
  | { state: "ok"; issues: readonly string[]; summary: string };

/** Into pilot: lab report, measurement CSV, and sound within tolerance of the estimate (or waived). */
export function pilotGate(facts: { labReport: boolean; measurements: boolean; sound: SoundVerdict; waiverReason: string | null }): GateRequirement[] {
  const sound = ((): GateRequirement => {
    const label = "Measured sound within tolerance, or waived";
    if (facts.waiverReason) return req("sound", label, true, `Waived: ${facts.waiverReason}`);
    if (!facts.measurements || facts.sound.state === "none") return req("sound", label, false, "No measurements to compare with the estimate yet.");
    if (facts.sound.state === "invalid") return req("sound", label, false, facts.sound.errors.join(" "));
    const [first, ...rest] = facts.sound.issues;
    return req("sound", label, !first, first ? [first, ...rest].join(" ") : facts.sound.summary);
  })();
  return [
    req("lab_report", "Lab report attached", facts.labReport, facts.labReport ? "The lab report (PDF) is attached." : "Attach the lab report (PDF)."),
    req("measurements", "Measurement CSV attached", facts.measurements, facts.measurements ? "The measurement CSV is attached." : "Attach the measurement CSV."),
    sound,
  ];
}

/** Into factory release: a release manager (or admin) does it, with release notes given in the same step. */
export function productionGate(facts: { moverRole: Role; releaseNotes: string | null | undefined }): GateRequirement[] {
  const mayRelease = facts.moverRole === "release_manager" || facts.moverRole === "admin";
  const notes: GateRequirement =
    facts.releaseNotes === undefined
      ? { key: "release_notes", label: "Release notes", state: "on_promotion", detail: "Written in the release dialog." }
      : req("release_notes", "Release notes", !!facts.releaseNotes?.trim(), facts.releaseNotes?.trim() ? "Release notes given." : "Write release notes before releasing to the factory.");
  return [req("release_manager", "Released by a release manager", mayRelease, mayRelease ? "Your role may release builds." : "Only a release manager releases a build to the factory."), notes];
}

/** Who may move a build into a stage, as a requirement of its own (the server checks it first). */
export function roleRequirement(role: Role, capability: Parameters<typeof can>[1], to: Stage): GateRequirement {
  const ok = can(role, capability);
  return req("role", "Your role may do this", ok, ok ? `Your role may move builds to ${STAGE_LABELS[to].toLowerCase()}.` : `Your role may not move builds to ${STAGE_LABELS[to].toLowerCase()}.`);
}
