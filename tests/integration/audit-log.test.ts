import { afterAll, describe, expect, it } from "vitest";
import { closeDb, demoActor, getDb } from "./support/db";
import { callRoute, tokenFor } from "./support/http";
import { createUser, updateUser } from "@/lib/use-cases/admin/users";
import { GET as listAudit } from "@/app/api/v1/audit/route";

afterAll(closeDb);

interface AuditItem {
  action: string;
  entityId: string;
  actorName: string;
  sentence: string;
  subject: { label: string; href: string | null } | null;
}

async function audit(token: string, query: Record<string, string>): Promise<{ status: number; items: AuditItem[] }> {
  const res = await callRoute(listAudit, { url: `/api/v1/audit?${new URLSearchParams(query).toString()}`, token });
  const body = (await res.json()) as { items?: AuditItem[] };
  return { status: res.status, items: body.items ?? [] };
}

const utcDay = (offsetDays: number) => new Date(Date.now() + offsetDays * 86_400_000).toISOString().slice(0, 10);

describe("audit log", () => {
  it("records role change, disable and re-enable as their own actions, each naming and linking the user in a sentence", async () => {
    const db = getDb();
    const admin = await demoActor("admin@tarnwell.example");
    const email = `audit-${Date.now()}@tarnwell.example`;
    const user = await createUser(db, admin, { email, name: "Oda Auditson", role: "viewer", passwordHash: "not-a-real-hash" });
    await updateUser(db, admin, { id: user.id, role: "support" });
    await updateUser(db, admin, { id: user.id, disabled: true });
    await updateUser(db, admin, { id: user.id, disabled: false });

    const token = await tokenFor("admin@tarnwell.example");
    // Filters ignore case: the entity type in capitals, the actor by part of the admin's name in other capitals.
    const { status, items } = await audit(token, { entityType: "USER", entityId: user.id, actor: "ilse BRAND" });
    expect(status).toBe(200);
    expect(items.map((e) => e.action)).toEqual(["user.enable", "user.disable", "user.role_change", "user.create"]);
    const [enable, disable, roleChange] = items;
    expect(roleChange!.sentence).toBe(`Ilse Brandvold changed the role of Oda Auditson (${email}) from viewer to support`);
    expect(disable!.sentence).toBe(`Ilse Brandvold disabled Oda Auditson (${email})`);
    expect(enable!.sentence).toBe(`Ilse Brandvold re-enabled Oda Auditson (${email})`);
    expect(enable!.subject).toEqual({ label: `Oda Auditson (${email})`, href: "/admin/users" });

    // "Who" matches the e-mail too, and the action filter picks one kind of change.
    expect((await audit(token, { entityId: user.id, actor: "ADMIN@tarnwell", action: "User.Disable" })).items.map((e) => e.action)).toEqual(["user.disable"]);
    // A name that did not act finds nothing; a LIKE wildcard typed into the filter is taken literally.
    expect((await audit(token, { entityId: user.id, actor: "Ada Fenwick" })).items).toEqual([]);
    expect((await audit(token, { entityId: user.id, actor: "%" })).items).toEqual([]);
  });

  it("filters by a range of UTC days, both ends included", async () => {
    const db = getDb();
    const admin = await demoActor("admin@tarnwell.example");
    const user = await createUser(db, admin, { email: `range-${Date.now()}@tarnwell.example`, name: "Rune Range", role: "viewer", passwordHash: "not-a-real-hash" });
    const token = await tokenFor("admin@tarnwell.example");
    const today = utcDay(0);
    expect((await audit(token, { entityId: user.id, from: today, to: today })).items.map((e) => e.action)).toEqual(["user.create"]);
    expect((await audit(token, { entityId: user.id, from: utcDay(1) })).items).toEqual([]);
    expect((await audit(token, { entityId: user.id, to: utcDay(-1) })).items).toEqual([]);
    const bad = await audit(token, { from: "yesterday" });
    expect(bad.status).toBe(400);
  });
});
