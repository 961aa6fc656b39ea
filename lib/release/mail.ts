import { STAGE_LABELS, type Stage } from "./stages";

/** A message to queue; the outbox delivers it after the transaction commits. */
export interface OutgoingMail {
  to: string[];
  subject: string;
  bodyText: string;
}

export interface BuildMailFacts {
  buildId: string;
  boardModel: string;
  version: string;
  actorName: string;
  /** Absolute link base, e.g. http://127.0.0.1:3000 */
  baseUrl: string;
}

const title = (b: BuildMailFacts) => `${b.boardModel} ${b.version}`;
const link = (b: BuildMailFacts) => `${b.baseUrl.replace(/\/$/, "")}/builds/${b.buildId}`;

function message(to: readonly string[], subject: string, lines: string[]): OutgoingMail[] {
  const unique = [...new Set(to)].sort();
  return unique.length === 0 ? [] : [{ to: unique, subject, bodyText: `${lines.join("\n")}\n` }];
}

/** Review requested: every eligible reviewer is asked. */
export function reviewRequestedMail(b: BuildMailFacts, reviewers: readonly string[]): OutgoingMail[] {
  return message(reviewers, `[Loopkeeper] Review requested: build ${title(b)}`, [
    `${b.actorName} asks for a review of build ${title(b)}.`,
    "",
    `Open it: ${link(b)}`,
  ]);
}

/** A reviewer's verdict goes to the build's author. */
export function verdictMail(b: BuildMailFacts, author: string, verdict: "approve" | "request_changes", comment: string): OutgoingMail[] {
  const what = verdict === "approve" ? "approved" : "requested changes on";
  return message([author], `[Loopkeeper] ${b.actorName} ${what} build ${title(b)}`, [
    `${b.actorName} ${what} build ${title(b)}.`,
    ...(comment ? ["", `Comment: ${comment}`] : []),
    "",
    `Open it: ${link(b)}`,
  ]);
}

/** Released to the factory or withdrawn: release managers and support must know. */
export function releaseMail(b: BuildMailFacts, to: Stage, recipients: readonly string[], reason: string | null): OutgoingMail[] {
  const verb = to === "withdrawn" ? "withdrawn" : `promoted to ${STAGE_LABELS[to].toLowerCase()}`;
  return message(recipients, `[Loopkeeper] Build ${title(b)} ${verb}`, [
    `${b.actorName} ${verb} build ${title(b)}.`,
    ...(reason ? ["", `${to === "withdrawn" ? "Reason" : "Release notes"}: ${reason}`] : []),
    "",
    `Open it: ${link(b)}`,
  ]);
}
