import { afterAll, beforeAll, describe, expect, it } from "vitest";
import fs from "node:fs";
import path from "node:path";
import { randomUUID } from "node:crypto";
import { and, count, eq } from "drizzle-orm";
import { closeDb, demoActor, getDb } from "./support/db";
import { callRoute, tokenFor } from "./support/http";
import { freshDraftBuild, mover } from "./support/builds";
import { auditEvents, buildReviews, builds, coolerModels, uploads } from "@/db/schema";
import { createUser, updateUser } from "@/lib/use-cases/admin/users";
import { getProfileDetail } from "@/db/profiles";
import { createProfile } from "@/lib/use-cases/profiles/create";
import { moveBuild } from "@/lib/use-cases/builds/stages";
import { buildDetail } from "@/lib/use-cases/builds/detail";
import { POST as postReview } from "@/app/api/v1/builds/[id]/reviews/route";
import { PATCH as patchReview } from "@/app/api/v1/builds/[id]/reviews/[reviewId]/route";
import { POST as postTransition } from "@/app/api/v1/builds/[id]/transitions/route";
import { POST as postEvidence } from "@/app/api/v1/builds/[id]/evidence/route";
import { POST as postVersion } from "@/app/api/v1/profiles/[id]/versions/route";
import { PUT as putDraft } from "@/app/api/v1/profiles/[id]/draft/route";
import { MEASUREMENT_HEADER } from "@/lib/release/measurements";
import { documentText } from "@/lib/registry/starter-profile";
import type { CoolingProfile } from "@/lib/engine";

process.env.LOOPKEEPER_LOG = "silent";
// Background delivery after a review or transition must not reach anybody's SMTP server.
process.env.SMTP_PORT = "1";
afterAll(closeDb);

type ErrorJson = { error: { code: string; message: string; issues?: { path: string; message: string }[] } };
const json = (body: unknown) => JSON.stringify(body);
const headers = { "content-type": "application/json" };

/** A reviewer account of its own, so disabling or demoting it cannot disturb other suites. */
async function freshReviewer(label: string) {
  const admin = await demoActor("admin@tarnwell.example");
  const email = `${label}-${randomUUID().slice(0, 8)}@tarnwell.example`;
  const { hashPassword } = await import("@/lib/platform/auth/password");
  const user = await createUser(getDb(), admin, { email, name: `Reviewer ${label}`, role: "engineer", passwordHash: await hashPassword("loopkeeper-demo") });
  return { user, email, token: await tokenFor(email) };
}

let engineerToken: string;
let releaseToken: string;

beforeAll(async () => {
  engineerToken = await tokenFor("engineer@tarnwell.example");
  releaseToken = await tokenFor("release@tarnwell.example");
});

async function inReview() {
  const b = await freshDraftBuild();
  const res = await callRoute(postTransition, { url: `/api/v1/builds/${b.id}/transitions`, method: "POST", token: engineerToken, params: { id: b.id }, headers, body: json({ from: "draft", to: "review" }) });
  expect(res.status).toBe(201);
  return b;
}

const approve = (buildId: string, token: string) =>
  callRoute(postReview, { url: `/api/v1/builds/${buildId}/reviews`, method: "POST", token, params: { id: buildId }, headers, body: json({ verdict: "approve" }) });

describe("reviews: one per reviewer, counted only while the reviewer may review", () => {
  it("answers a second approval by the same reviewer with 409 and keeps one row; a verdict change is an explicit update", async () => {
    const b = await inReview();
    const r = await freshReviewer("twice");
    const first = await approve(b.id, r.token);
    expect(first.status).toBe(201);
    const second = await approve(b.id, r.token);
    expect(second.status).toBe(409);
    expect(((await second.json()) as ErrorJson).error.message).toMatch(/You already approved this build on \d{4}-\d{2}-\d{2}; one review per reviewer\. To change your verdict/);
    const rows = await getDb().select().from(buildReviews).where(and(eq(buildReviews.buildId, b.id), eq(buildReviews.reviewerUserId, r.user.id)));
    expect(rows).toHaveLength(1);

    // The database refuses a second row even if the application's check were bypassed.
    const direct = await getDb()
      .insert(buildReviews)
      .values({ buildId: b.id, reviewerUserId: r.user.id, verdict: "approve" })
      .then(() => "inserted", (e: unknown) => String((e as { cause?: { message?: string } }).cause?.message ?? e));
    expect(direct).toMatch(/build_reviews_build_reviewer_key/);

    const changed = await callRoute(patchReview, {
      url: `/api/v1/builds/${b.id}/reviews/${rows[0]!.id}`,
      method: "PATCH",
      token: r.token,
      params: { id: b.id, reviewId: rows[0]!.id },
      headers,
      body: json({ verdict: "request_changes", comment: "Fan floor too high at 25 °C." }),
    });
    expect(changed.status).toBe(200);
    const [after] = await getDb().select().from(buildReviews).where(eq(buildReviews.id, rows[0]!.id));
    expect(after!.verdict).toBe("request_changes");
    const events = await getDb().select().from(auditEvents).where(and(eq(auditEvents.entityId, b.id), eq(auditEvents.action, "build.review.change")));
    expect(events).toHaveLength(1);
    expect(events[0]!.before).toMatchObject({ verdict: "approve" });
  });

  it("does not open the gate on the approval of a reviewer disabled (or demoted) before promotion, and says why", async () => {
    const b = await inReview();
    const kept = await freshReviewer("kept");
    const leaving = await freshReviewer("leaving");
    expect((await approve(b.id, kept.token)).status).toBe(201);
    expect((await approve(b.id, leaving.token)).status).toBe(201);
    const admin = await demoActor("admin@tarnwell.example");
    await updateUser(getDb(), admin, { id: leaving.user.id, disabled: true });

    const refused = await callRoute(postTransition, { url: `/api/v1/builds/${b.id}/transitions`, method: "POST", token: releaseToken, params: { id: b.id }, headers, body: json({ from: "review", to: "validation" }) });
    expect(refused.status).toBe(422);
    expect(((await refused.json()) as ErrorJson).error.message).toMatch(/1 of 2 required approvals/);
    const detail = await buildDetail(getDb(), { id: b.id });
    expect(detail.approvals.counting).toBe(1);
    const byReviewer = new Map(detail.reviews.map((r) => [r.reviewerUserId, r.standing]));
    expect(byReviewer.get(kept.user.id)).toEqual({ counts: true, reason: null });
    expect(byReviewer.get(leaving.user.id)).toEqual({ counts: false, reason: "The reviewer's account is disabled." });

    // Re-enabled but demoted to viewer: still not counted, with the role named.
    await updateUser(getDb(), admin, { id: leaving.user.id, disabled: false, role: "viewer" });
    const again = await buildDetail(getDb(), { id: b.id });
    expect(again.reviews.find((r) => r.reviewerUserId === leaving.user.id)!.standing.reason).toMatch(/role is now Viewer, which may not review builds/);

    // Back as an engineer, the same approval counts again and the gate opens.
    await updateUser(getDb(), admin, { id: leaving.user.id, role: "engineer" });
    const release = await mover("release@tarnwell.example");
    await moveBuild(release, { id: b.id, from: "review", to: "validation" });
    const [row] = await getDb().select().from(builds).where(eq(builds.id, b.id));
    expect(row!.stage).toBe("validation");
  });

  it("lists an approval by a profile version's author as not counting, and refuses such a reviewer outright", async () => {
    const b = await inReview();
    // A row as old data might hold it: the author of the build's profile versions approving.
    await getDb().insert(buildReviews).values({ buildId: b.id, reviewerUserId: b.authorUserId, verdict: "approve" });
    const detail = await buildDetail(getDb(), { id: b.id });
    expect(detail.approvals.counting).toBe(0);
    expect(detail.reviews[0]!.standing).toEqual({ counts: false, reason: "The reviewer created this build." });
    const res = await approve(b.id, engineerToken);
    expect(res.status).toBe(403);
  });
});

describe("publish checks every board revision the range admits", () => {
  async function ownProfile() {
    const db = getDb();
    const engineer = await demoActor("engineer@tarnwell.example");
    const [cooler] = await db.select().from(coolerModels).where(eq(coolerModels.name, "Tarn 360"));
    const profile = await createProfile(db, engineer, { coolerModelId: cooler!.id, name: `Range ${randomUUID().slice(0, 8)}`, description: "" });
    const detail = await getProfileDetail(db, { id: profile.id });
    return { profile, doc: JSON.parse(detail!.profile.draftText!) as CoolingProfile };
  }

  /** A document whose curves have `n` points, still rising to full speed below the critical temperature. */
  function withPoints(doc: CoolingProfile, n: number): CoolingProfile {
    const pts = (from: number) => Array.from({ length: n }, (_, i) => ({ tempC: 20 + i * 2.5, dutyPct: Math.min(100, Math.round(from + ((100 - from) * i) / (n - 1))) }));
    return { ...doc, pump: { ...doc.pump, points: pts(60) }, fans: { ...doc.fans, points: pts(40) } };
  }

  /** Publishes version 1.0.0 of the engineer's own profile through the route. */
  function publishOwn(profileId: string, body: { changelog: string; boardRange: string; text: string }) {
    return callRoute(postVersion, {
      url: `/api/v1/profiles/${profileId}/versions`,
      method: "POST",
      token: engineerToken,
      params: { id: profileId },
      headers,
      body: json({ version: "1.0.0", ...body }),
    });
  }

  it("refuses a 7-point curve for >=1.0.0, naming revision 1.0.0 (6 points) and the narrowest range that fits", async () => {
    const { profile, doc } = await ownProfile();
    const res = await publishOwn(profile.id, { changelog: "Seven points.", boardRange: ">=1.0.0", text: documentText(withPoints(doc, 7)) });
    expect(res.status).toBe(422);
    const body = (await res.json()) as ErrorJson;
    // TC-1 revision 1.0.0 stores 6 points per curve (the demo board's seeded limits).
    expect(body.error.message).toMatch(/revision 1\.0\.0 \(a curve has 7 points; it stores at most 6\)/);
    expect(body.error.message).not.toMatch(/revision 1\.1\.0 \(/);
    expect(body.error.message).toMatch(/Narrow the range to ">=1\.1\.0 <=/);
    expect(body.error.issues).toContainEqual({ path: "/boardRange", message: "Revision 1.0.0: a curve has 7 points; it stores at most 6." });
    expect(await getDb().select({ n: count() }).from(auditEvents).where(and(eq(auditEvents.action, "profile_version.publish"), eq(auditEvents.entityId, profile.id)))).toEqual([{ n: 0 }]);
  });

  it("refuses a 16-point curve whose range reaches the 96-byte sample revision, naming each revision that cannot hold it", async () => {
    const { profile, doc } = await ownProfile();
    const res = await publishOwn(profile.id, { changelog: "Sixteen points.", boardRange: ">=0.9.0", text: documentText(withPoints(doc, 16)) });
    expect(res.status).toBe(422);
    const message = ((await res.json()) as ErrorJson).error.message;
    // 8 + (15 + 8 + 2·32) + 4 = 99 bytes by docs/bank-format.md, against the sample's 96-byte EEPROM.
    expect(message).toMatch(/revision 0\.9\.0 \(the image takes 99 bytes; it has 96 bytes of profile memory\)/);
    expect(message).toMatch(/revision 1\.0\.0 \(a curve has 16 points; it stores at most 6\)/);
    expect(message).toMatch(/revision 1\.1\.0 \(a curve has 16 points; it stores at most 8\)/);
    expect(message).toMatch(/Narrow the range to "(2\.0\.0|>=2\.0\.0 <=[\d.]+)"/);
  });

  it("lets only the owner (or an admin, on record) publish into a profile", async () => {
    const { profile, doc } = await ownProfile();
    const text = documentText(doc);
    const body = json({ version: "1.0.0", changelog: "First.", boardRange: ">=1.0.0 <3.0.0", text });
    const other = await callRoute(postVersion, { url: `/api/v1/profiles/${profile.id}/versions`, method: "POST", token: await tokenFor("engineer2@tarnwell.example"), params: { id: profile.id }, headers, body });
    expect(other.status).toBe(403);
    expect(((await other.json()) as ErrorJson).error.message).toMatch(/belongs to .+; only its owner or an administrator publishes/);
    const admin = await callRoute(postVersion, { url: `/api/v1/profiles/${profile.id}/versions`, method: "POST", token: await tokenFor("admin@tarnwell.example"), params: { id: profile.id }, headers, body });
    expect(admin.status).toBe(201);
    const { version } = (await admin.json()) as { version: { id: string } };
    const [event] = await getDb().select().from(auditEvents).where(and(eq(auditEvents.action, "profile_version.publish"), eq(auditEvents.entityId, version.id)));
    expect(event!.after).toMatchObject({ onBehalfOfOwnerUserId: (await demoActor("engineer@tarnwell.example")).userId });
  });
});

describe("measurement CSV with bad rows", () => {
  it("is refused on upload with the row errors for the file input, storing no file and no row", async () => {
    const b = await freshDraftBuild();
    const storageDir = path.resolve(process.env.STORAGE_DIR ?? ".data/uploads");
    const files = () => (fs.existsSync(storageDir) ? fs.readdirSync(storageDir).length : 0);
    const rows = async () => (await getDb().select({ n: count() }).from(uploads))[0]!.n;
    const [filesBefore, rowsBefore] = [files(), await rows()];
    const csv = `${MEASUREMENT_HEADER}\n40,2000,1200,31.5\n45,fast,1500,33\n50,2600\n`;
    const res = await callRoute(postEvidence, { url: `/api/v1/builds/${b.id}/evidence?kind=measurements&name=bad.csv`, method: "POST", token: releaseToken, params: { id: b.id }, body: csv });
    expect(res.status).toBe(422);
    const body = (await res.json()) as ErrorJson;
    expect(body.error.message).toMatch(/nothing was stored/);
    expect(body.error.issues).toEqual([
      { path: "/file", message: "Line 3: pump_rpm must be a number from 0 to 20000." },
      { path: "/file", message: "Line 4: expected 4 values, found 2." },
    ]);
    expect(files()).toBe(filesBefore);
    expect(await rows()).toBe(rowsBefore);
    const [row] = await getDb().select().from(builds).where(eq(builds.id, b.id));
    expect(row!.measurementsUploadId).toBeNull();
  });
});

describe("draft saves with optimistic concurrency", () => {
  it("refuses a save based on a stale draft revision with 409 naming who saved in between", async () => {
    const db = getDb();
    const engineer = await demoActor("engineer@tarnwell.example");
    const [cooler] = await db.select().from(coolerModels).where(eq(coolerModels.name, "Tarn 240"));
    const profile = await createProfile(db, engineer, { coolerModelId: cooler!.id, name: `Shared ${randomUUID().slice(0, 8)}`, description: "" });
    const loaded = (await getProfileDetail(db, { id: profile.id }))!.profile;
    const save = (token: string, text: string, baseRevision: number) =>
      callRoute(putDraft, { url: `/api/v1/profiles/${profile.id}/draft`, method: "PUT", token, params: { id: profile.id }, headers, body: json({ text, baseRevision }) });

    const theirs = await save(await tokenFor("engineer2@tarnwell.example"), '{ "name": "their edit" }', loaded.draftRevision);
    expect(theirs.status).toBe(200);
    expect(((await theirs.json()) as { draftRevision: number }).draftRevision).toBe(loaded.draftRevision + 1);

    const mine = await save(engineerToken, "{ }", loaded.draftRevision);
    expect(mine.status).toBe(409);
    const engineer2 = await mover("engineer2@tarnwell.example");
    expect(((await mine.json()) as ErrorJson).error.message).toMatch(new RegExp(`^${engineer2.name} saved this draft at \\d{2}:\\d{2} UTC after you loaded it`));
    // Their text is still what the server holds.
    expect((await getProfileDetail(db, { id: profile.id }))!.profile.draftText).toMatch(/their edit/);

    const rebased = await save(engineerToken, "{ }", loaded.draftRevision + 1);
    expect(rebased.status).toBe(200);
  });
});
