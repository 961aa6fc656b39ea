/**
 * How an audit event reads to a person: what it changed (a name with its version and a
 * link to it) and one sentence ("Erin Example published Quiet 1.1.0"). The stored event keeps
 * its machine action code and ids; these words are made when it is shown.
 */
import { STAGE_LABELS, STAGE_ORDER } from "@/lib/release/stages";

/** The thing an event changed, as people name it, with where to see it (null when no screen shows it). */
export interface AuditSubject {
  label: string;
  href: string | null;
}

/** What the database knows of each kind of thing an event may point at, enough to name and link it. */
export type AuditSubjectFacts =
  | { entityType: "build"; id: string; boardModelName: string; version: string }
  | { entityType: "profile"; id: string; name: string; coolerModelName: string }
  | { entityType: "profile_version"; id: string; profileId: string; profileName: string; version: string }
  | { entityType: "production_lot"; id: string; lotCode: string }
  | { entityType: "user"; id: string; name: string; email: string }
  | { entityType: "board_revision"; id: string; boardModelName: string; revision: string }
  | { entityType: "board_model"; id: string; name: string }
  | { entityType: "component"; id: string; name: string }
  | { entityType: "cooler_model"; id: string; name: string }
  | { entityType: "api_token"; id: string; name: string }
  | { entityType: "upload"; id: string; originalName: string };

/** The version's row in its profile's version history: the editor page anchors each version by its number. */
export function profileVersionHref(profileId: string, version: string): string {
  return `/profiles/${profileId}#version-${version}`;
}

/** Name and link of a thing an audit event changed. */
export function auditSubject(f: AuditSubjectFacts): AuditSubject {
  switch (f.entityType) {
    case "build":
      return { label: `${f.boardModelName} build ${f.version}`, href: `/builds/${f.id}` };
    case "profile":
      return { label: `${f.coolerModelName} · ${f.name}`, href: `/profiles/${f.id}` };
    case "profile_version":
      return { label: `${f.profileName} ${f.version}`, href: profileVersionHref(f.profileId, f.version) };
    case "production_lot":
      return { label: `lot ${f.lotCode}`, href: `/lots?code=${encodeURIComponent(f.lotCode)}` };
    case "user":
      return { label: `${f.name} (${f.email})`, href: `/admin/users` };
    case "board_revision":
      return { label: `${f.boardModelName} revision ${f.revision}`, href: `/board-revisions/${f.id}` };
    case "board_model":
      return { label: f.name, href: "/boards" };
    case "component":
      return { label: f.name, href: "/components" };
    case "cooler_model":
      return { label: f.name, href: `/profiles?coolerModelId=${f.id}` };
    case "api_token":
      return { label: `API token "${f.name}"`, href: null };
    case "upload":
      return { label: `file ${f.originalName}`, href: null };
  }
}


function field(obj: unknown, key: string): unknown {
  return typeof obj === "object" && obj !== null && key in obj ? (obj as Record<string, unknown>)[key] : undefined;
}

const word = (v: unknown): string => (typeof v === "string" ? v : "");

/**
 * A thing that is gone, named from the event's own copy of it where it keeps a name people
 * use (a deleted lot's code), rather than an id prefix.
 */
function goneLabel(e: { entityType: string; before: unknown; after: unknown }): string | null {
  const kept = (key: string) => word(field(e.after, key)) || word(field(e.before, key));
  if (e.entityType === "production_lot" && kept("lotCode")) return `lot ${kept("lotCode")}`;
  return null;
}

/**
 * One sentence for an event: "<who> <did what to> <thing>". `subject` names the thing; when
 * it is gone (deleted or unknown), the name the event kept, or else the entity type and an id
 * prefix, stand in.
 */
export function auditSentence(
  who: string,
  e: { action: string; entityType: string; entityId: string; before: unknown; after: unknown },
  subject: AuditSubject | null,
): string {
  const what = subject?.label ?? goneLabel(e) ?? `${e.entityType.replace(/_/g, " ")} ${e.entityId.slice(0, 8)}`;
  const stageCode = word(field(e.after, "stage"));
  const stage = STAGE_ORDER.find((s) => s === stageCode);
  const verb = ((): string => {
    switch (e.action) {
      case "profile_version.publish":
        return `published ${what}`;
      case "profile.create":
        return `created the profile ${what}`;
      case "profile.draft_save":
        return `saved a draft of ${what}`;
      case "build.create":
        return `created ${what}`;
      case "build.promote":
        return `moved ${what} to ${stage ? STAGE_LABELS[stage] : "its next stage"}`;
      case "build.withdraw":
        return `withdrew ${what}`;
      case "build.review.approve":
        return `approved ${what}`;
      case "build.review.request_changes":
        return `asked for changes to ${what}`;
      case "build.review.change":
        return field(e.after, "verdict") === "approve" ? `changed their review of ${what} to an approval` : `changed their review of ${what} to a request for changes`;
      case "build.review.resolve":
        return `marked a requested change to ${what} as resolved`;
      case "build.waiver":
        return `recorded a waiver on ${what}`;
      case "lot.create":
        return `created ${what}`;
      case "lot.import":
        return `imported ${what}`;
      case "user.create":
        return `added the user ${what}`;
      case "user.role_change":
        return `changed the role of ${what} from ${word(field(e.before, "role"))} to ${word(field(e.after, "role"))}`;
      case "user.disable":
        return `disabled ${what}`;
      case "user.enable":
        return `re-enabled ${what}`;
      case "user.password_change":
        return `changed the password of ${what}`;
      case "token.create":
        return `created ${what}`;
      case "token.revoke":
        return `revoked ${what}`;
      case "upload.create":
        return `uploaded ${what}`;
    }
    if (e.action.startsWith("build.attach.")) return `attached ${e.action.slice("build.attach.".length).replace(/_/g, " ")} to ${what}`;
    if (e.action.endsWith(".create")) return `created ${what}`;
    if (e.action.endsWith(".update")) return `changed ${what}`;
    return `${e.action.replace(/[._]/g, " ")} on ${what}`;
  })();
  return `${who} ${verb}`;
}

/**
 * The audit action for a change of a user account: one action per kind of change, so the
 * log can be filtered for role changes, disables and re-enables apart.
 */
export function userChangeActions(before: { role: string; disabledAt: unknown }, after: { role: string; disabledAt: unknown }): string[] {
  const actions: string[] = [];
  if (before.role !== after.role) actions.push("user.role_change");
  if (!before.disabledAt && after.disabledAt) actions.push("user.disable");
  if (before.disabledAt && !after.disabledAt) actions.push("user.enable");
  return actions;
}
