import "server-only";
import { asc, eq, sql } from "drizzle-orm";
import { users, type Role, type User } from "./schema";
import type { Executor } from "./client";

/** What the app may show of a user: never the password hash. */
export type PublicUser = Pick<User, "id" | "email" | "name" | "role" | "disabledAt" | "createdAt">;

export function toPublicUser(u: User): PublicUser {
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
  return rows.map(toPublicUser);
}

export async function listActiveUsersByRole(db: Executor, { roles }: { roles: Role[] }): Promise<PublicUser[]> {
  const rows = await db.select().from(users).orderBy(asc(users.name));
  return rows.filter((u) => !u.disabledAt && roles.includes(u.role)).map(toPublicUser);
}

export async function insertUser(tx: Executor, input: { email: string; name: string; role: Role; passwordHash: string }): Promise<User> {
  const [row] = await tx.insert(users).values(input).returning();
  if (!row) throw new Error("INSERT … RETURNING gave no row");
  return row;
}

/** A user's row, locked until the transaction ends. */
export async function lockUser(tx: Executor, { id }: { id: string }): Promise<User | undefined> {
  const [row] = await tx.select().from(users).where(eq(users.id, id)).for("update");
  return row;
}

export async function updateUserRow(tx: Executor, { id, patch }: { id: string; patch: Partial<User> }): Promise<User> {
  const [row] = await tx.update(users).set(patch).where(eq(users.id, id)).returning();
  if (!row) throw new Error("UPDATE … RETURNING gave no row");
  return row;
}

/** Stores a new password hash; false when there is no such user. */
export async function setPasswordHash(tx: Executor, { id, passwordHash }: { id: string; passwordHash: string }): Promise<boolean> {
  const res = await tx.update(users).set({ passwordHash, updatedAt: new Date() }).where(eq(users.id, id)).returning({ id: users.id });
  return res.length > 0;
}
