import "server-only";
import { and, count, desc, eq, ilike, sql, type SQL } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { components, coolerModels, boardModels, profiles, profileVersions, users } from "./schema";
import type { Executor } from "./client";
import { likeText, orderFor, pageWindow } from "./list-helpers";
import { listRevisionsOfModel } from "./boards";
import { documentText } from "@/lib/registry/starter-profile";
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

/** Writes a new profile owned by `ownerUserId`, its starter draft as text and as the last plottable document. */
export async function insertProfile(tx: Executor, input: { coolerModelId: string; name: string; description: string; ownerUserId: string; draftText: string; draftDocument: unknown }) {
  const [row] = await tx.insert(profiles).values({ ...input, draftUpdatedAt: new Date() }).returning();
  if (!row) throw new Error("INSERT … RETURNING gave no row");
  return row;
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
      radiatorMm: hw.cooler.radiatorMm,
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

/** A profile's draft revision, when and by whom it was last saved; the profile row stays locked until the transaction ends. */
export async function lockDraft(tx: Executor, { id }: { id: string }) {
  const [row] = await tx
    .select({ draftRevision: profiles.draftRevision, draftUpdatedAt: profiles.draftUpdatedAt, savedBy: users.name })
    .from(profiles)
    .leftJoin(users, eq(users.id, profiles.draftSavedByUserId))
    .where(eq(profiles.id, id))
    .for("update", { of: profiles });
  return row;
}

/**
 * Stores the draft text as typed, with its new revision and who saved it; `plottable`, when
 * given, replaces the draft's last plottable document.
 */
export async function writeDraft(tx: Executor, { id, text, plottable, draftRevision, savedByUserId, at }: { id: string; text: string; plottable?: unknown; draftRevision: number; savedByUserId: string; at: Date }) {
  await tx
    .update(profiles)
    .set({ draftText: text, ...(plottable ? { draftDocument: plottable } : {}), draftUpdatedAt: at, updatedAt: at, draftRevision, draftSavedByUserId: savedByUserId })
    .where(eq(profiles.id, id));
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
