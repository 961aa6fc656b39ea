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

/** Every mail the release path sends; each subject and body is written as whole sentences. */
export type BuildMailEvent = "review_requested" | "approved" | "changes_requested" | "validation" | "pilot" | "production" | "withdrawn";

interface Template {
  subject: (build: string) => string;
  /** The opening sentence; `note` (a comment, release notes or a reason) follows under its label. */
  opening: (actor: string, build: string) => string;
  noteLabel?: string;
  /** What the recipient is asked to do, as a sentence. */
  ask: string;
}

export const BUILD_MAIL_TEMPLATES: Record<BuildMailEvent, Template> = {
  review_requested: {
    subject: (build) => `Build ${build} is waiting for your review`,
    opening: (actor, build) => `${actor} asks you to review build ${build}. You may approve it because you wrote neither the build nor any profile version in it.`,
    ask: "Please approve it or request changes on the build page.",
  },
  approved: {
    subject: (build) => `Your build ${build} was approved`,
    opening: (actor, build) => `${actor} approved build ${build}.`,
    noteLabel: "Comment",
    ask: "The build page shows how many approvals still count toward lab validation.",
  },
  changes_requested: {
    subject: (build) => `Changes were requested on your build ${build}`,
    opening: (actor, build) => `${actor} requested changes on build ${build}.`,
    noteLabel: "Comment",
    ask: "Mark the request resolved on the build page once the build has been changed.",
  },
  validation: {
    subject: (build) => `Build ${build} has entered lab validation`,
    opening: (actor, build) => `${actor} moved build ${build} into lab validation after its reviews were approved.`,
    ask: "The lab measures it on real hardware and attaches the lab report and the measurement CSV to the build page.",
  },
  pilot: {
    subject: (build) => `Build ${build} has entered the pilot run`,
    opening: (actor, build) => `${actor} moved build ${build} into the pilot run after its lab validation; its bank image is now signed.`,
    ask: "Watch the pilot boards; the build goes to the factory only after a release manager confirms it.",
  },
  production: {
    subject: (build) => `Build ${build} was released to the factory`,
    opening: (actor, build) => `${actor} released build ${build} to the factory, so production stations now flash it onto new boards.`,
    noteLabel: "Release notes",
    ask: "Support finds it by serial number once the first lot is recorded.",
  },
  withdrawn: {
    subject: (build) => `Build ${build} was withdrawn`,
    opening: (actor, build) => `${actor} withdrew build ${build}; it will not be promoted again.`,
    noteLabel: "Reason",
    ask: "Support sees the reason beside every board that shipped with it.",
  },
};

/** The mail for `event` to `recipients` (deduplicated and sorted), or none when nobody is to be told. */
export function buildMail(event: BuildMailEvent, b: BuildMailFacts, recipients: readonly string[], note: string | null = null): OutgoingMail[] {
  const t = BUILD_MAIL_TEMPLATES[event];
  const build = `${b.boardModel} ${b.version}`;
  const to = [...new Set(recipients)].sort();
  if (to.length === 0) return [];
  const lines = [
    t.opening(b.actorName, build),
    ...(note?.trim() && t.noteLabel ? ["", `${t.noteLabel}: ${note.trim()}`] : []),
    "",
    t.ask,
    "",
    `Open the build: ${b.baseUrl.replace(/\/$/, "")}/builds/${b.buildId}`,
  ];
  return [{ to, subject: `[Loopkeeper] ${t.subject(build)}`, bodyText: `${lines.join("\n")}\n` }];
}
