import "server-only";
import { eq, inArray } from "drizzle-orm";
import {
  apiTokens,
  boardModels,
  boardRevisions,
  builds,
  components,
  coolerModels,
  productionLots,
  profileVersions,
  profiles,
  uploads,
  users,
} from "./schema";
import type { Executor } from "./client";
import { auditSentence, auditSubject, type AuditSubject, type AuditSubjectFacts } from "@/lib/audit/describe";

interface EventRef {
  actorUserId: string | null;
  actorLabel: string;
  action: string;
  entityType: string;
  entityId: string;
  before: unknown;
  after: unknown;
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** The ids of one entity type among the events (only well-formed uuids reach the uuid columns). */
function idsOf(events: EventRef[], entityType: string): string[] {
  return [...new Set(events.filter((e) => e.entityType === entityType && UUID.test(e.entityId)).map((e) => e.entityId))];
}

/** Facts naming every thing the events point at, one query per entity type present. */
async function subjectFacts(db: Executor, events: EventRef[]): Promise<AuditSubjectFacts[]> {
  const ids = (t: string) => idsOf(events, t);
  const out: AuditSubjectFacts[] = [];
  const q = async <T>(t: string, run: (ids: string[]) => Promise<T[]>, map: (row: T) => AuditSubjectFacts) => {
    const wanted = ids(t);
    if (wanted.length) out.push(...(await run(wanted)).map(map));
  };
  await q(
    "build",
    (w) => db.select({ id: builds.id, version: builds.version, boardModelName: boardModels.name }).from(builds).innerJoin(boardModels, eq(boardModels.id, builds.boardModelId)).where(inArray(builds.id, w)),
    (r) => ({ entityType: "build", ...r }),
  );
  await q(
    "profile",
    (w) => db.select({ id: profiles.id, name: profiles.name, coolerModelName: coolerModels.name }).from(profiles).innerJoin(coolerModels, eq(coolerModels.id, profiles.coolerModelId)).where(inArray(profiles.id, w)),
    (r) => ({ entityType: "profile", ...r }),
  );
  await q(
    "profile_version",
    (w) =>
      db
        .select({ id: profileVersions.id, version: profileVersions.version, profileId: profiles.id, profileName: profiles.name })
        .from(profileVersions)
        .innerJoin(profiles, eq(profiles.id, profileVersions.profileId))
        .where(inArray(profileVersions.id, w)),
    (r) => ({ entityType: "profile_version", ...r }),
  );
  await q("production_lot", (w) => db.select({ id: productionLots.id, lotCode: productionLots.lotCode }).from(productionLots).where(inArray(productionLots.id, w)), (r) => ({ entityType: "production_lot", ...r }));
  await q("user", (w) => db.select({ id: users.id, name: users.name, email: users.email }).from(users).where(inArray(users.id, w)), (r) => ({ entityType: "user", ...r }));
  await q(
    "board_revision",
    (w) =>
      db
        .select({ id: boardRevisions.id, revision: boardRevisions.revision, boardModelName: boardModels.name })
        .from(boardRevisions)
        .innerJoin(boardModels, eq(boardModels.id, boardRevisions.boardModelId))
        .where(inArray(boardRevisions.id, w)),
    (r) => ({ entityType: "board_revision", ...r }),
  );
  await q("board_model", (w) => db.select({ id: boardModels.id, name: boardModels.name }).from(boardModels).where(inArray(boardModels.id, w)), (r) => ({ entityType: "board_model", ...r }));
  await q("component", (w) => db.select({ id: components.id, name: components.name }).from(components).where(inArray(components.id, w)), (r) => ({ entityType: "component", ...r }));
  await q("cooler_model", (w) => db.select({ id: coolerModels.id, name: coolerModels.name }).from(coolerModels).where(inArray(coolerModels.id, w)), (r) => ({ entityType: "cooler_model", ...r }));
  await q("api_token", (w) => db.select({ id: apiTokens.id, name: apiTokens.name }).from(apiTokens).where(inArray(apiTokens.id, w)), (r) => ({ entityType: "api_token", ...r }));
  await q("upload", (w) => db.select({ id: uploads.id, originalName: uploads.originalName }).from(uploads).where(inArray(uploads.id, w)), (r) => ({ entityType: "upload", ...r }));
  return out;
}

/**
 * Audit events with what people read: the actor's name, the changed thing named with its
 * version and linked, and the event as one sentence. A handful of queries per page, not one per row.
 */
export async function describeAuditEvents<E extends EventRef>(db: Executor, events: E[]): Promise<(E & { actorName: string; subject: AuditSubject | null; sentence: string })[]> {
  if (events.length === 0) return [];
  const facts = await subjectFacts(db, events);
  const subjects = new Map(facts.map((f) => [`${f.entityType}:${f.id}`, auditSubject(f)]));
  const actorIds = [...new Set(events.map((e) => e.actorUserId).filter((id): id is string => id !== null))];
  const actors = actorIds.length ? await db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, actorIds)) : [];
  const names = new Map(actors.map((a) => [a.id, a.name]));
  return events.map((e) => {
    const subject = subjects.get(`${e.entityType}:${e.entityId}`) ?? null;
    const viaToken = e.actorLabel.endsWith("(API token)") ? " (API token)" : "";
    const actorName = (e.actorUserId && names.get(e.actorUserId) ? `${names.get(e.actorUserId)}${viaToken}` : null) ?? e.actorLabel;
    return { ...e, actorName, subject, sentence: auditSentence(actorName, e, subject) };
  });
}
