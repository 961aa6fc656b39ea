import { afterAll, describe, expect, it } from "vitest";
import { and, eq, sql } from "drizzle-orm";
import { closeDb, demoActor, getDb } from "./support/db";
import { auditEvents, boardModels, coolerModels, profileVersions } from "@/db/schema";
import { getProfileDetail } from "@/db/profiles";
import { createProfile } from "@/lib/use-cases/profiles/create";
import { saveDraft } from "@/lib/use-cases/profiles/save-draft";
import { listVersionsForBoardModel } from "@/db/profile-versions";
import { publishProfileVersion as publishVersion } from "@/lib/use-cases/profiles/publish";
import { listComponents } from "@/db/components";
import { createComponent } from "@/lib/use-cases/registry/save-component";
import { AppError } from "@/lib/api/errors";
import { bankBytes, crc32, decodeBank, encodeBank, type CoolingProfile } from "@/lib/engine";
import { compatibilityCells } from "@/lib/registry/version-image";
import { documentText } from "@/lib/registry/starter-profile";

afterAll(closeDb);

async function newProfile(label: string) {
  const db = getDb();
  const engineer = await demoActor("engineer@tarnwell.example");
  const [cooler] = await db.select().from(coolerModels).where(eq(coolerModels.name, "Tarn 360"));
  const profile = await createProfile(db, engineer, { coolerModelId: cooler!.id, name: `${label} ${Date.now()}-${Math.random().toString(36).slice(2, 6)}`, description: "" });
  const detail = await getProfileDetail(db, { id: profile.id });
  return { db, engineer, profile, text: detail!.profile.draftText! };
}

const publish = (p: Awaited<ReturnType<typeof newProfile>>, version: string, text = p.text) =>
  publishVersion(p.db, { ...p.engineer, role: "engineer" }, { profileId: p.profile.id, version, changelog: "test", boardRange: ">=1.0.0 <3.0.0", text });

describe("profile versions", () => {
  it("refuses to change a published document in the database itself", async () => {
    const p = await newProfile("Immutable");
    const v = await publish(p, "1.0.0");
    // Drizzle wraps the driver error; the trigger's message is on the cause.
    const causeOf = (e: unknown) => String((e as { cause?: { message?: string } }).cause?.message ?? e);
    const upd = await p.db.execute(sql`update profile_versions set document = '{}'::jsonb where id = ${v.id}`).catch(causeOf);
    expect(upd).toMatch(/profile_versions rows are immutable: UPDATE refused/);
    const del = await p.db.execute(sql`delete from profile_versions where id = ${v.id}`).catch(causeOf);
    expect(del).toMatch(/immutable: DELETE refused/);
    const [row] = await p.db.select().from(profileVersions).where(eq(profileVersions.id, v.id));
    expect((row!.document as CoolingProfile).formatVersion).toBe(1);
  });

  it("lets exactly one of two concurrent publishes of the same number win; the other is a 409 conflict", async () => {
    const p = await newProfile("Race");
    const results = await Promise.allSettled([publish(p, "1.0.0"), publish(p, "1.0.0")]);
    const won = results.filter((r) => r.status === "fulfilled");
    const lost = results.filter((r): r is PromiseRejectedResult => r.status === "rejected");
    expect(won).toHaveLength(1);
    expect(lost).toHaveLength(1);
    const err = lost[0]!.reason as AppError;
    expect(err).toBeInstanceOf(AppError);
    expect(err.code).toBe("conflict");
    expect(err.status).toBe(409);
    expect(err.message).toMatch(/1\.0\.0/);
    const rows = await p.db.select().from(profileVersions).where(eq(profileVersions.profileId, p.profile.id));
    expect(rows).toHaveLength(1);
  });

  it("refuses a version that is not greater than every existing one", async () => {
    const p = await newProfile("Order");
    await publish(p, "1.1.0");
    await expect(publish(p, "1.0.5")).rejects.toMatchObject({ code: "conflict", message: expect.stringMatching(/not greater than 1\.1\.0/) as unknown });
    await expect(publish(p, "1.1.0")).rejects.toMatchObject({ code: "conflict" });
    const v = await publish(p, "1.2.0");
    expect(v.version).toBe("1.2.0");
  });

  it("refuses an invalid document with its issues (422) and writes nothing", async () => {
    const p = await newProfile("Invalid");
    const doc = JSON.parse(p.text) as CoolingProfile;
    doc.pump.points[0]!.dutyPct = 10; // below the Brook D3 pump's 40 % minimum duty
    const err = (await publish(p, "1.0.0", documentText(doc)).catch((e: unknown) => e)) as AppError;
    expect(err.code).toBe("validation_failed");
    expect(err.issues?.some((i) => i.path === "/pump/points/0/dutyPct")).toBe(true);
    expect(await p.db.select().from(profileVersions).where(eq(profileVersions.profileId, p.profile.id))).toHaveLength(0);
  });

  it("stores the encoded size, CRC and content hash the engine computes, and audits the publish", async () => {
    const p = await newProfile("Encoded");
    const v = await publish(p, "1.0.0");
    const doc = JSON.parse(p.text) as CoolingProfile;
    // Size formula of docs/bank-format.md: 8-byte header + slot + 4-byte CRC trailer.
    expect(v.encodedBytes).toBe(bankBytes([{ pumpPoints: doc.pump.points.length, fanPoints: doc.fans.points.length }]));
    const image = encodeBank([{ profile: doc, version: "1.0.0", contentHashHex: v.contentHash }]);
    if (!image.ok) throw new Error("encode failed");
    // CRC-32/ISO-HDLC over all bytes before the trailer, which decodeBank checks independently.
    expect(v.crc32).toBe(crc32(image.bytes, 0, 0, image.bytes.length - 4));
    expect(decodeBank(image.bytes).ok).toBe(true);
    const events = await p.db.select().from(auditEvents).where(and(eq(auditEvents.entityId, v.id), eq(auditEvents.action, "profile_version.publish")));
    expect(events).toHaveLength(1);
  });

  it("keeps an unfinished draft verbatim", async () => {
    const p = await newProfile("Draft");
    await saveDraft(p.db, p.engineer, { id: p.profile.id, text: '{ "name": ' });
    const detail = await getProfileDetail(p.db, { id: p.profile.id });
    expect(detail!.profile.draftText).toBe('{ "name": ');
  });
});

describe("compatibility of the demo versions", () => {
  it("shows a memory 'no' for the 16-point Surge 2.0.0 on the 96-byte sample revision", async () => {
    const db = getDb();
    const [board] = await db.select().from(boardModels).where(eq(boardModels.serialPrefix, "TC1"));
    const detail = await getProfileDetail(db, { id: (await db.execute<{ id: string }>(sql`select id from profiles where name = 'Surge'`)).rows[0]!.id });
    const revisions = detail!.revisions;
    const rows = await listVersionsForBoardModel(db, { boardModelId: board!.id });
    const surge2 = rows.find((r) => r.profileName === "Surge" && r.version === "2.0.0")!;
    // 8 + (15 + 8 + 2·32) + 4 = 99 bytes by docs/bank-format.md.
    expect(surge2.encodedBytes).toBe(99);
    const cells = compatibilityCells(surge2, revisions);
    const byRev = Object.fromEntries(revisions.map((r, i) => [r.revision, cells[i]!]));
    expect(byRev["0.9.0"]!.ok).toBe(false);
    expect(byRev["0.9.0"]!.reasons.join(" ")).toMatch(/99 bytes but the revision has 96/);
    expect(byRev["1.0.0"]!.reasons.join(" ")).toMatch(/outside the range/);
    expect(byRev["2.0.0"]!.ok).toBe(true);
  });
});

describe("components", () => {
  it("filters, sorts and pages on the server and audits creation", async () => {
    const db = getDb();
    const admin = await demoActor("admin@tarnwell.example");
    const name = `Test fan ${Date.now()}`;
    const c = await createComponent(db, admin, { kind: "fan", name, minDutyPct: 20, rpmAtMinDuty: 500, maxRpm: 1800, tachPulsesPerRev: 2, refSoundDbA: 30, refRpm: 1800, soundExponent: 50, flowAtMaxRpmLpm: null });
    const page = await listComponents(db, { q: name, dir: "asc", page: 1, pageSize: 10 });
    expect(page.items.map((i) => i.id)).toEqual([c.id]);
    const pumps = await listComponents(db, { kind: "pump", sort: "maxRpm", dir: "desc", page: 1, pageSize: 50 });
    expect(pumps.items.every((i) => i.kind === "pump")).toBe(true);
    const rpms = pumps.items.map((i) => i.maxRpm);
    expect(rpms).toEqual([...rpms].sort((a, b) => b - a));
    await expect(createComponent(db, admin, { ...c, name })).rejects.toThrow();
  });

  it("stores a fan's zero-duty behaviour and measured sound table; the database refuses a malformed table; old rows keep their minimum speed", async () => {
    const db = getDb();
    const admin = await demoActor("admin@tarnwell.example");
    const base = { kind: "fan" as const, minDutyPct: 20, rpmAtMinDuty: 500, maxRpm: 1800, tachPulsesPerRev: 2, refSoundDbA: 30, refRpm: 1800, soundExponent: 50, flowAtMaxRpmLpm: null };
    const soundTable = { distanceM: 1, points: [{ rpm: 500, soundDbA: 14 }, { rpm: 1800, soundDbA: 30 }] };
    const c = await createComponent(db, admin, { ...base, name: `Table fan ${Date.now()}`, soundTable, stopsAtZeroDuty: true });
    expect(c.soundTable).toEqual(soundTable);
    expect(c.stopsAtZeroDuty).toBe(true);
    const plain = await createComponent(db, admin, { ...base, name: `Plain fan ${Date.now()}` });
    expect(plain.stopsAtZeroDuty).toBe(false);
    expect(plain.soundTable).toBeNull();
    await expect(createComponent(db, admin, { ...base, name: `Bad table ${Date.now()}`, soundTable: { distanceM: 1, points: [{ rpm: 500, soundDbA: 14 }] } })).rejects.toThrow();
  });
});
