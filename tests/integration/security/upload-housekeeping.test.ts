// Upload housekeeping, against OWASP ASVS 4.0.3 V12.1.3 (a per-user quota so one person cannot
// fill the storage) and V12.1 generally (files nobody uses do not pile up): pending uploads are
// capped per person and removed after the stated time; files a build uses are kept.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq, sql } from "drizzle-orm";
import { closeDb, getDb } from "../support/db";
import { callRoute, tokenFor } from "../support/http";
import { freshDraftBuild } from "../support/builds";
import { builds, uploads, users } from "@/db/schema";
import { POST as uploadFirmware } from "@/app/api/v1/uploads/route";
import { PENDING_UPLOAD_HOURS, PENDING_UPLOAD_QUOTA_BYTES } from "@/lib/release/upload-check";
import { removeUnusedUploads } from "@/lib/use-cases/builds/uploads";
import { getStorage } from "@/lib/platform/storage";

process.env.LOOPKEEPER_LOG = "silent";

let email = "";
let userId = "";

beforeAll(async () => {
  email = `uploader-${Date.now()}@tarnwell.example`;
  const [u] = await getDb().insert(users).values({ email, name: "Upload Filler", role: "engineer", passwordHash: "x" }).returning();
  userId = u!.id;
});
afterAll(closeDb);

async function storedRow(ageHours: number, sizeBytes: number, by: string | null = userId) {
  const put = await getStorage().put(new Blob([new Uint8Array([1, 2, 3])]).stream(), { maxBytes: 16 });
  const [row] = await getDb()
    .insert(uploads)
    .values({ kind: "firmware", storageKey: put.key, originalName: "old.bin", contentType: "application/octet-stream", sizeBytes, sha256: put.sha256, uploadedByUserId: by, createdAt: new Date(Date.now() - ageHours * 3_600_000) })
    .returning();
  return row!;
}

describe(`ASVS 12.1.3 — each person holds at most ${PENDING_UPLOAD_QUOTA_BYTES / 1024 / 1024} MiB of uploads no build uses`, () => {
  it("an upload past the quota is refused with the amounts in words, and nothing is stored", async () => {
    await storedRow(1, PENDING_UPLOAD_QUOTA_BYTES - 100);
    const token = await tokenFor(email);
    const before = (await getDb().select({ n: sql<number>`count(*)::int` }).from(uploads).where(eq(uploads.uploadedByUserId, userId)))[0]!.n;
    const res = await callRoute(uploadFirmware, { url: "/api/v1/uploads?name=fw.bin", method: "POST", token, body: new Uint8Array(1000) });
    expect(res.status).toBe(413);
    expect(((await res.json()) as { error: { message: string } }).error.message).toMatch(/64\.0 MiB.*removed 24 hours/);
    const after = (await getDb().select({ n: sql<number>`count(*)::int` }).from(uploads).where(eq(uploads.uploadedByUserId, userId)))[0]!.n;
    expect(after).toBe(before);
  });
});

describe(`unused uploads are removed ${PENDING_UPLOAD_HOURS} hours after they arrive; files a build uses stay`, () => {
  it("the sweep removes an old unused upload (row and bytes), keeps a young one and an old one a build uses", async () => {
    const old = await storedRow(PENDING_UPLOAD_HOURS + 1, 3, null);
    const young = await storedRow(PENDING_UPLOAD_HOURS - 1, 3, null);
    const used = await storedRow(PENDING_UPLOAD_HOURS + 5, 3, null);
    const b = await freshDraftBuild();
    await getDb().update(builds).set({ firmwareUploadId: used.id }).where(eq(builds.id, b.id));

    const removed = await removeUnusedUploads();
    expect(removed).toBeGreaterThanOrEqual(1);
    const left = new Set((await getDb().select({ id: uploads.id }).from(uploads)).map((r) => r.id));
    expect(left.has(old.id)).toBe(false);
    expect(left.has(young.id)).toBe(true);
    expect(left.has(used.id)).toBe(true);
    await expect(getStorage().get(old.storageKey)).rejects.toThrow();
    expect(new Uint8Array(await getStorage().get(used.storageKey))).toEqual(new Uint8Array([1, 2, 3]));
    const audit = await getDb().execute<{ n: number }>(sql`select count(*)::int as n from audit_events where action = 'upload.expire' and (after->'ids') ? ${old.id}`);
    expect(audit.rows[0]?.n).toBe(1);
  });
});
