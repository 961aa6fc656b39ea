import { afterAll, describe, expect, it } from "vitest";
import { sql } from "drizzle-orm";
import { closeDb, demoActor, getDb } from "./support/db";
import { findActiveToken } from "@/db/tokens";
import { createToken, revokeToken } from "@/lib/use-cases/account/tokens";
import { updateUser } from "@/lib/use-cases/admin/users";
import { auditEvents, users } from "@/db/schema";
import { eq } from "drizzle-orm";

afterAll(closeDb);

describe("foundation data rules", () => {
  it("writes the audit event in the same transaction as the change", async () => {
    const db = getDb();
    const admin = await demoActor("admin@tarnwell.example");
    const token = await createToken(db, admin, { userId: admin.userId, name: "it", tokenHash: `h-${Date.now()}`, tokenPrefix: "lk_test", expiresAt: new Date(Date.now() + 86_400_000) });
    const events = await db.select().from(auditEvents).where(eq(auditEvents.entityId, token.id));
    expect(events.map((e) => e.action)).toEqual(["token.create"]);
    await revokeToken(db, admin, { id: token.id, userId: admin.userId });
    expect(await findActiveToken(db, { tokenHash: `h-${token.id}` })).toBeUndefined();
  });

  it("refuses to change or delete audit events", async () => {
    const db = getDb();
    // Drizzle wraps the driver error; PostgreSQL's own message is the cause.
    const refused = { cause: expect.objectContaining({ message: expect.stringMatching(/immutable/) }) };
    await expect(db.execute(sql`update audit_events set action = 'tampered'`)).rejects.toMatchObject(refused);
    await expect(db.execute(sql`delete from audit_events`)).rejects.toMatchObject(refused);
  });

  it("ends sessions of a disabled user by bumping the session epoch", async () => {
    const db = getDb();
    const admin = await demoActor("admin@tarnwell.example");
    const [victim] = await db
      .insert(users)
      .values({ email: `epoch-${Date.now()}@tarnwell.example`, name: "Epoch", role: "viewer", passwordHash: "x" })
      .returning();
    const after = await updateUser(db, admin, { id: victim!.id, disabled: true });
    expect(after.disabledAt).not.toBeNull();
    const [row] = await db.select().from(users).where(eq(users.id, victim!.id));
    expect(row!.sessionEpoch).toBe(victim!.sessionEpoch + 1);
  });

  it("refuses an admin disabling themself", async () => {
    const db = getDb();
    const admin = await demoActor("admin@tarnwell.example");
    await expect(updateUser(db, admin, { id: admin.userId, disabled: true })).rejects.toThrow(/cannot disable yourself/);
  });
});
