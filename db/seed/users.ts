import { sql } from "drizzle-orm";
import bcrypt from "bcryptjs";
import type { Database } from "../client";
import { users, type Role } from "../schema";

/** Demo accounts, one per role (two extra engineers so a build can get two independent approvals). */
export const DEMO_PASSWORD = "loopkeeper-demo";
export const DEMO_USERS: { email: string; name: string; role: Role }[] = [
  { email: "admin@tarnwell.example", name: "Ilse Brandvold", role: "admin" },
  { email: "engineer@tarnwell.example", name: "Teodor Quist", role: "engineer" },
  { email: "engineer2@tarnwell.example", name: "Maren Ostby", role: "engineer" },
  { email: "engineer3@tarnwell.example", name: "Pavo Lindqvist", role: "engineer" },
  { email: "release@tarnwell.example", name: "Sunniva Kalt", role: "release_manager" },
  { email: "support@tarnwell.example", name: "Edvin Morrow", role: "support" },
  { email: "viewer@tarnwell.example", name: "Ada Fenwick", role: "viewer" },
];

export async function seedUsers(db: Database): Promise<Record<string, string>> {
  const hash = await bcrypt.hash(DEMO_PASSWORD, 10);
  for (const u of DEMO_USERS) {
    await db.insert(users).values({ ...u, passwordHash: hash }).onConflictDoNothing();
  }
  const rows = await db.select({ id: users.id, email: users.email }).from(users).where(sql`lower(${users.email}) like '%@tarnwell.example'`);
  return Object.fromEntries(rows.map((r) => [r.email, r.id]));
}
