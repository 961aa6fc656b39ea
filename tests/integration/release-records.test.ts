import { afterAll, describe, expect, it } from "vitest";
import { and, eq, ne } from "drizzle-orm";
import { closeDb, getDb } from "./support/db";
import { buildSlots, builds, mailOutbox } from "@/db/schema";

afterAll(closeDb);

// Drizzle wraps the driver error; PostgreSQL's own message is the cause.
const refused = (re: RegExp) => ({ cause: expect.objectContaining({ message: expect.stringMatching(re) }) });

describe("records the database keeps as they are", () => {
  it("refuses changing the content of a build past draft, or deleting it", async () => {
    const db = getDb();
    const [released] = await db.select().from(builds).where(eq(builds.stage, "production")).limit(1);
    expect(released, "the demo has a production build").toBeTruthy();
    await expect(db.update(builds).set({ revisionRange: ">=0.0.0" }).where(eq(builds.id, released!.id))).rejects.toMatchObject(refused(/immutable/));
    await expect(db.update(builds).set({ bankSha256: "0".repeat(64) }).where(eq(builds.id, released!.id))).rejects.toMatchObject(refused(/immutable/));
    await expect(db.delete(builds).where(eq(builds.id, released!.id))).rejects.toMatchObject(refused(/immutable/));
    await expect(db.update(buildSlots).set({ slotIndex: 9 }).where(eq(buildSlots.buildId, released!.id))).rejects.toMatchObject(refused(/immutable/));
    await expect(db.delete(buildSlots).where(eq(buildSlots.buildId, released!.id))).rejects.toMatchObject(refused(/immutable/));
  });

  it("refuses any change to a withdrawn build", async () => {
    const db = getDb();
    const [withdrawn] = await db.select().from(builds).where(eq(builds.stage, "withdrawn")).limit(1);
    expect(withdrawn).toBeTruthy();
    await expect(db.update(builds).set({ stage: "production" }).where(eq(builds.id, withdrawn!.id))).rejects.toMatchObject(refused(/immutable/));
  });

  it("still lets a draft be edited, and a stage move on", async () => {
    const db = getDb();
    const [draft] = await db.select().from(builds).where(eq(builds.stage, "draft")).limit(1);
    expect(draft).toBeTruthy();
    const [edited] = await db.update(builds).set({ revisionRange: draft!.revisionRange, updatedAt: new Date() }).where(eq(builds.id, draft!.id)).returning();
    expect(edited?.id).toBe(draft!.id);
  });

  it("refuses changing or deleting sent mail, but not mail still waiting", async () => {
    const db = getDb();
    const [sent] = await db
      .insert(mailOutbox)
      .values({ toAddresses: ["release@tarnwell.example"], subject: "guard test (sent)", bodyText: "x", status: "sent", sentAt: new Date() })
      .returning();
    await expect(db.update(mailOutbox).set({ subject: "rewritten" }).where(eq(mailOutbox.id, sent!.id))).rejects.toMatchObject(refused(/immutable/));
    await expect(db.delete(mailOutbox).where(eq(mailOutbox.id, sent!.id))).rejects.toMatchObject(refused(/immutable/));
    const [pending] = await db
      .insert(mailOutbox)
      .values({ toAddresses: ["release@tarnwell.example"], subject: "guard test (pending)", bodyText: "x", status: "failed" })
      .returning();
    await db.update(mailOutbox).set({ attempts: 1 }).where(and(eq(mailOutbox.id, pending!.id), ne(mailOutbox.status, "sent")));
  });
});
