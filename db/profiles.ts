import "server-only";
import { and, count, desc, eq, ilike, sql, type SQL } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { components, coolerModels, boardModels, profiles, profileVersions, users } from "./schema";
import type { Database, Executor } from "./client";
import { recordAudit, type AuditActor } from "./audit";
import { likeText, orderFor, pageWindow } from "./list-helpers";
import { listRevisionsOfModel } from "./boards";
import { AppError } from "@/lib/api/errors";
import { documentText, starterProfile } from "@/lib/registry/starter-profile";
import { validateProfileText } from "@/lib/engine";

const SORT_COLUMNS = { name: profiles.name, coolerModel: coolerModels.name, updatedAt: profiles.updatedAt };

const latestVersion = sql<string | null>`(select ${profileVersions.version} from ${profileVersions} where ${profileVersions.profileId} = ${profiles.id}
  order by ${profileVersions.versionMajor} desc, ${profileVersions.versionMinor} desc, ${profileVersions.versionPatch} desc limit 1)`;

export async function listProfiles(
  db: Executor,
  f: { q?: string; coolerModelId?: string; sort?: keyof typeof SORT_COLUMNS; dir: "asc" | "desc"; page: number; pageSize: number },
) {
  const where: SQL[] = [];
  if (f.q) where.push(ilike(profiles.name, likeText(f.q)));
  if (f.coolerModelId) where.push(eq(profiles.coolerModelId, f.coolerModelId));
  const cond = where.length ? and(...where) : undefined;
  const [items, [total]] = await Promise.all([
    db
      .select({
        id: profiles.id,
        name: profiles.name,
        description: profiles.description,
        coolerModelId: profiles.coolerModelId,
        coolerModelName: coolerModels.name,
        ownerName: users.name,
        latestVersion,
        versionCount: sql<number>`(select count(*)::int from ${profileVersions} where ${profileVersions.profileId} = ${profiles.id})`,
        updatedAt: profiles.updatedAt,
      })
      .from(profiles)
      .innerJoin(coolerModels, eq(coolerModels.id, profiles.coolerModelId))
      .innerJoin(users, eq(users.id, profiles.ownerUserId))
      .where(cond)
      .orderBy(...orderFor(SORT_COLUMNS, f.sort, f.dir, "name", profiles.id))
      .limit(pageWindow(f).limit)
      .offset(pageWindow(f).offset),
    db.select({ n: count() }).from(profiles).innerJoin(coolerModels, eq(coolerModels.id, profiles.coolerModelId)).where(cond),
  ]);
  return { items, total: total?.n ?? 0, page: f.page, pageSize: f.pageSize };
}

/** Creates a profile with a starter draft fitted to its cooler's parts. */
export async function createProfile(db: Database, actor: AuditActor & { userId: string }, input: { coolerModelId: string; name: string; description: string }) {
  return db.transaction(async (tx) => {
    const hw = await getCoolerHardware(tx, { coolerModelId: input.coolerModelId });
    if (!hw) throw new AppError("validation_failed", "Pick an existing cooler model.", { issues: [{ path: "/coolerModelId", message: "No such cooler model." }] });
    const draft = starterProfile({ name: input.name, description: input.description, pumpMinDutyPct: hw.pump.minDutyPct, fanMinDutyPct: hw.fan.minDutyPct });
    const [row] = await tx
      .insert(profiles)
      .values({ ...input, ownerUserId: actor.userId, draftText: documentText(draft), draftDocument: draft, draftUpdatedAt: new Date() })
      .returning();
    if (!row) throw new AppError("internal", "The profile was not created.");
    await recordAudit(tx, actor, { action: "profile.create", entityType: "profile", entityId: row.id, after: { ...input, ownerUserId: actor.userId } });
    return { id: row.id, name: row.name };
  });
}

const fanPart = alias(components, "fan_part");
const pumpPart = alias(components, "pump_part");

/** A cooler model with its fan, pump and board model, as the engine's hardware context needs them. */
export async function getCoolerHardware(db: Executor, { coolerModelId }: { coolerModelId: string }) {
  const [row] = await db
    .select({ cooler: coolerModels, fan: fanPart, pump: pumpPart, boardModelName: boardModels.name })
    .from(coolerModels)
    .innerJoin(fanPart, eq(fanPart.id, coolerModels.fanComponentId))
    .innerJoin(pumpPart, eq(pumpPart.id, coolerModels.pumpComponentId))
    .innerJoin(boardModels, eq(boardModels.id, coolerModels.boardModelId))
    .where(eq(coolerModels.id, coolerModelId));
  if (!row) return undefined;
  const revisions = await listRevisionsOfModel(db, { boardModelId: row.cooler.boardModelId });
  return { ...row, revisions };
}

/**
 * The last draft text that passed the schema, only while the current draft does not (the
 * editor plots it greyed, so a broken draft still shows its curves); null otherwise.
 */
function lastPlottableDraftOf(p: { draftText: string | null; draftDocument: unknown }): string | null {
  if (p.draftText === null || typeof p.draftDocument !== "object" || p.draftDocument === null) return null;
  return validateProfileText(p.draftText).value ? null : documentText(p.draftDocument);
}

/** The draft as its author typed it; rows saved before drafts were kept as text fall back to their parsed JSON. */
function draftTextOf(p: { draftText: string | null; draftDocument: unknown }): string | null {
  if (p.draftText !== null) return p.draftText;
  const draft = p.draftDocument;
  if (draft === null || draft === undefined) return null;
  // An unfinished draft that was not valid JSON was kept verbatim as a JSON string.
  return typeof draft === "string" ? draft : documentText(draft);
}

export async function getProfileRow(db: Executor, { id }: { id: string }) {
  const [row] = await db.select().from(profiles).where(eq(profiles.id, id));
  return row;
}

export async function getProfileDetail(db: Executor, { id }: { id: string }) {
  const [row] = await db.select({ profile: profiles, ownerName: users.name }).from(profiles).innerJoin(users, eq(users.id, profiles.ownerUserId)).where(eq(profiles.id, id));
  if (!row) return undefined;
  const hw = await getCoolerHardware(db, { coolerModelId: row.profile.coolerModelId });
  if (!hw) return undefined;
  const versions = await listVersionsOfProfile(db, { profileId: id });
  const p = row.profile;
  return {
    profile: { id: p.id, name: p.name, description: p.description, ownerName: row.ownerName, draftText: draftTextOf(p), lastPlottableDraftText: lastPlottableDraftOf(p), draftUpdatedAt: p.draftUpdatedAt?.toISOString() ?? null, draftRevision: p.draftRevision },
    cooler: {
      id: hw.cooler.id,
      name: hw.cooler.name,
      fanCount: hw.cooler.fanCount,
      radiatorKPerWAtMinFan: hw.cooler.radiatorKPerWAtMinFan,
      radiatorKPerWAtMaxFan: hw.cooler.radiatorKPerWAtMaxFan,
      boardModelName: hw.boardModelName,
    },
    fan: hw.fan,
    pump: hw.pump,
    revisions: hw.revisions,
    versions,
  };
}

/**
 * Saves the working draft as the exact text typed (even when it is not valid JSON yet), so
 * nothing typed is lost or reordered. When the text passes the schema it is also kept as the
 * draft's last plottable document, which the editor plots (greyed) while the text is broken.
 * Optimistic concurrency: the caller says which draft revision its text is based on; if
 * someone saved since, the save is refused (409) naming who, so nobody overwrites another's
 * work unseen. `baseRevision` undefined replaces the draft outright (an explicit import).
 */
export async function saveDraft(db: Database, actor: AuditActor & { userId: string }, { id, text, baseRevision }: { id: string; text: string; baseRevision?: number }) {
  const plottable = validateProfileText(text).value;
  return db.transaction(async (tx) => {
    const [current] = await tx
      .select({ draftRevision: profiles.draftRevision, draftUpdatedAt: profiles.draftUpdatedAt, savedBy: users.name })
      .from(profiles)
      .leftJoin(users, eq(users.id, profiles.draftSavedByUserId))
      .where(eq(profiles.id, id))
      .for("update", { of: profiles });
    if (!current) throw new AppError("not_found", "No such profile.");
    if (baseRevision !== undefined && baseRevision !== current.draftRevision) {
      const who = current.savedBy ?? "Someone";
      const when = current.draftUpdatedAt ? ` at ${current.draftUpdatedAt.toISOString().slice(11, 16)} UTC` : "";
      throw new AppError(
        "conflict",
        `${who} saved this draft${when} after you loaded it (draft revision ${current.draftRevision}, yours is based on ${baseRevision}). Compare your text with theirs or reload it before saving again.`,
      );
    }
    const now = new Date();
    const draftRevision = current.draftRevision + 1;
    await tx
      .update(profiles)
      .set({ draftText: text, ...(plottable ? { draftDocument: plottable } : {}), draftUpdatedAt: now, updatedAt: now, draftRevision, draftSavedByUserId: actor.userId })
      .where(eq(profiles.id, id));
    // The draft itself is not repeated in the log: autosave runs on every pause in typing.
    await recordAudit(tx, actor, { action: "profile.draft_save", entityType: "profile", entityId: id, after: { bytes: text.length, draftRevision } });
    return { draftUpdatedAt: now.toISOString(), draftRevision };
  });
}

export async function listVersionsOfProfile(db: Executor, { profileId }: { profileId: string }) {
  const rows = await db
    .select({
      id: profileVersions.id,
      profileId: profileVersions.profileId,
      version: profileVersions.version,
      boardRange: profileVersions.boardRange,
      encodedBytes: profileVersions.encodedBytes,
      crc32: profileVersions.crc32,
      contentHash: profileVersions.contentHash,
      changelog: profileVersions.changelog,
      authorName: users.name,
      createdAt: profileVersions.createdAt,
    })
    .from(profileVersions)
    .innerJoin(users, eq(users.id, profileVersions.authorUserId))
    .where(eq(profileVersions.profileId, profileId))
    .orderBy(desc(profileVersions.versionMajor), desc(profileVersions.versionMinor), desc(profileVersions.versionPatch));
  return rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() }));
}
