import { randomUUID } from "node:crypto";
import { eq } from "drizzle-orm";
import { getDb } from "@/db/client";
import { boardModels, components, coolerModels, profiles, uploads } from "@/db/schema";
import { demoProfileDocument, insertProfileVersion } from "@/db/seed/builds";
import { createBuild } from "@/lib/use-cases/builds/create";
import { demoActor } from "./db";

/** A build version no other test run is likely to have used; parts stay within the bank's 0–255. */
export function uniqueVersion(): string {
  const r = (lo: number, hi: number) => lo + Math.floor(Math.random() * (hi - lo + 1));
  return `${r(100, 255)}.${r(0, 255)}.${r(0, 255)}`;
}

/** Two fresh published profile versions for the Tarn 240, written by `authorEmail`. */
export async function freshProfileVersions(authorEmail = "engineer@tarnwell.example", boardRange = ">=1.0.0") {
  const db = getDb();
  const author = await demoActor(authorEmail);
  const [cooler] = await db.select().from(coolerModels).where(eq(coolerModels.name, "Tarn 240"));
  const [fan] = await db.select().from(components).where(eq(components.id, cooler!.fanComponentId));
  const [pump] = await db.select().from(components).where(eq(components.id, cooler!.pumpComponentId));
  const out = [];
  for (const style of ["balanced", "quiet"] as const) {
    const [profile] = await db.insert(profiles).values({ coolerModelId: cooler!.id, name: `Test ${style} ${randomUUID().slice(0, 8)}`, ownerUserId: author.userId }).returning();
    out.push(await insertProfileVersion(db, { profileId: profile!.id, version: "1.0.0", boardRange, document: demoProfileDocument(profile!.name, style, fan!.minDutyPct, pump!.minDutyPct), authorUserId: author.userId }));
  }
  return out;
}

export async function demoBoardId(): Promise<string> {
  const [board] = await getDb().select().from(boardModels).where(eq(boardModels.name, "TC-1 cooler controller"));
  return board!.id;
}

/** A draft build by `authorEmail`, made through the same check and insert the API uses. */
export async function freshDraftBuild(opts: { authorEmail?: string; revisionRange?: string; profileAuthorEmail?: string } = {}) {
  const db = getDb();
  const author = await demoActor(opts.authorEmail ?? "engineer@tarnwell.example");
  const versions = await freshProfileVersions(opts.profileAuthorEmail);
  const boardModelId = await demoBoardId();
  const revisionRange = opts.revisionRange ?? ">=1.0.0 <3.0.0";
  const [fw] = await db.insert(uploads).values({ kind: "firmware", storageKey: randomUUID(), originalName: "fw.bin", contentType: "application/octet-stream", sizeBytes: 1, sha256: "0".repeat(64), uploadedByUserId: author.userId }).returning();
  const { build } = await createBuild(db, author, { boardModelId, version: uniqueVersion(), revisionRange, firmwareUploadId: fw!.id, slots: versions.map((v) => v.id) });
  return { ...build, authorUserId: author.userId, profileVersions: versions };
}

/** A demo account as a mover for lib/use-cases/builds/stages. */
export async function mover(email: string) {
  const a = await demoActor(email);
  const { getUserByEmail } = await import("@/db/users");
  const u = await getUserByEmail(getDb(), { email });
  return { ...a, role: u!.role, name: u!.name };
}

/** The demo accounts the release-path tests act as, by the part of their address before the @. */
export async function demoMovers() {
  const names = ["engineer", "engineer2", "engineer3", "admin", "release"] as const;
  const all = await Promise.all(names.map((n) => mover(`${n}@tarnwell.example`)));
  return Object.fromEntries(names.map((n, i) => [n, all[i]!])) as Record<(typeof names)[number], Awaited<ReturnType<typeof mover>>>;
}

/** Bytes as a stream of chunks, the way a request body arrives. */
export async function* chunksOf(bytes: Uint8Array, chunkBytes = 16 * 1024): AsyncGenerator<Uint8Array> {
  for (let i = 0; i < bytes.length; i += chunkBytes) yield bytes.subarray(i, i + chunkBytes);
}
