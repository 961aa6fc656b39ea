import "server-only";
import { asc, eq, sql } from "drizzle-orm";
import { users, type Role, type User } from "./schema";
import type { Database, Executor } from "./client";
import { recordAudit, type AuditActor } from "./audit";
import { AppError } from "@/lib/api/errors";
import { userChangeActions } from "@/lib/audit/describe";

/** What the app may show of a user: never the password hash. */
export type PublicUser = Pick<User, "id" | "email" | "name" | "role" | "disabledAt" | "createdAt">;

function toPublic(u: User): PublicUser {
  return { id: u.id, email: u.email, name: u.name, role: u.role, disabledAt: u.disabledAt, createdAt: u.createdAt };
}

export async function getUserById(db: Executor, { id }: { id: string }): Promise<User | undefined> {
  const [row] = await db.select().from(users).where(eq(users.id, id)).limit(1);
  return row;
}

export async function getUserByEmail(db: Executor, { email }: { email: string }): Promise<User | undefined> {
  const [row] = await db.select().from(users).where(sql`lower(${users.email}) = lower(${email})`).limit(1);
  return row;
}

export async function listUsers(db: Executor): Promise<PublicUser[]> {
  const rows = await db.select().from(users).orderBy(asc(users.name));
  return rows.map(toPublic);
}

export async function listActiveUsersByRole(db: Executor, { roles }: { roles: Role[] }): Promise<PublicUser[]> {
  const rows = await db.select().from(users).orderBy(asc(users.name));
  return rows.filter((u) => !u.disabledAt && roles.includes(u.role)).map(toPublic);
}

export async function createUser(
  db: Database,
  actor: AuditActor,
  input: { email: string; name: string; role: Role; passwordHash: string },
): Promise<PublicUser> {
  return db.transaction(async (tx) => {
    const existing = await getUserByEmail(tx, { email: input.email });
    if (existing) throw new AppError("conflict", `A user with the e-mail ${input.email} already exists.`);
    const [row] = await tx.insert(users).values(input).returning();
    if (!row) throw new AppError("internal", "User was not created.");
    const after = toPublic(row);
    await recordAudit(tx, actor, { action: "user.create", entityType: "user", entityId: row.id, after });
    return after;
  });
}

export async function updateUser(
  db: Database,
  actor: AuditActor,
  { id, role, disabled }: { id: string; role?: Role; disabled?: boolean },
): Promise<PublicUser> {
  return db.transaction(async (tx) => {
    const [current] = await tx.select().from(users).where(eq(users.id, id)).for("update");
    if (!current) throw new AppError("not_found", "No such user.");
    if (actor.userId === id && (disabled === true || (role && role !== "admin"))) {
      throw new AppError("conflict", "You cannot disable yourself or remove your own admin role; ask another admin.");
    }
    const patch: Partial<User> = { updatedAt: new Date() };
    if (role) patch.role = role;
    if (disabled === true && !current.disabledAt) {
      patch.disabledAt = new Date();
      // Sessions signed before this moment stop working at their next request.
      patch.sessionEpoch = current.sessionEpoch + 1;
    }
    if (disabled === false) patch.disabledAt = null;
    const [row] = await tx.update(users).set(patch).where(eq(users.id, id)).returning();
    if (!row) throw new AppError("internal", "User was not updated.");
    // One event per kind of change (role change, disable, re-enable), so the log tells them apart.
    const actions = userChangeActions(current, row);
    for (const action of actions.length ? actions : ["user.update"]) {
      await recordAudit(tx, actor, { action, entityType: "user", entityId: id, before: toPublic(current), after: toPublic(row) });
    }
    return toPublic(row);
  });
}

export async function setPasswordHash(db: Database, actor: AuditActor, { id, passwordHash }: { id: string; passwordHash: string }) {
  await db.transaction(async (tx) => {
    const res = await tx.update(users).set({ passwordHash, updatedAt: new Date() }).where(eq(users.id, id)).returning({ id: users.id });
    if (res.length === 0) throw new AppError("not_found", "No such user.");
    await recordAudit(tx, actor, { action: "user.password_change", entityType: "user", entityId: id });
  });
}
