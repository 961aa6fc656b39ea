// Password rules and the password change, against OWASP ASVS 4.0.3 V2.1:
// 2.1.1 (at least 12 characters), 2.1.7 (checked against a set of breached passwords — here the
// password list shipped in @zxcvbn-ts/language-common), 2.1.2/2.4.1 with bcrypt's documented
// 72-byte input limit (longer input is ignored by bcrypt, so it is refused, not truncated),
// and the change needs a person's session (V2.1.6: the current password is asked; a token is not a person).
import bcrypt from "bcryptjs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "../support/db";
import { callRoute, tokenFor } from "../support/http";
import * as usersRoute from "@/app/api/v1/users/route";
import * as passwordRoute from "@/app/api/v1/me/password/route";

process.env.LOOPKEEPER_LOG = "silent";
process.env.API_RATE_LIMIT_PER_MIN = "100000";

let admin = "";
const json = (body: unknown) => ({ body: JSON.stringify(body), headers: { "content-type": "application/json" } });
const create = (password: string) =>
  callRoute(usersRoute.POST, { url: "/api/v1/users", method: "POST", token: admin, ...json({ email: `pw-${Date.now()}-${Math.random().toString(36).slice(2)}@tarnwell.example`, name: "Password Rules", role: "viewer", password }) });

beforeAll(async () => {
  admin = await tokenFor("admin@tarnwell.example");
});
afterAll(closeDb);

describe("ASVS 2.1 — password rules", () => {
  it("bcrypt ignores input past 72 bytes (the reason for the limit), and such passwords are refused rather than cut", async () => {
    // The library itself shows the truncation: two passwords equal in their first 72 bytes match one hash.
    const a = "x".repeat(72) + "first-ending";
    const b = "x".repeat(72) + "other-ending";
    expect(await bcrypt.compare(b, await bcrypt.hash(a, 4))).toBe(true);
    const res = await create("correct horse battery staple ".repeat(3)); // 87 bytes
    expect(res.status).toBe(422);
    expect(await res.text()).toMatch(/at most 72 bytes/);
    // Bytes, not characters: 25 three-byte characters are 75 bytes.
    expect((await create("€".repeat(25))).status).toBe(422);
  });

  it("ASVS 2.1.7 — a password on the shipped breached/common list is refused", async () => {
    // "password1234" and "qwerty123456" (any case) are in the list of the @zxcvbn-ts/language-common 3.0.4 package.
    for (const common of ["password1234", "QWERTY123456"]) {
      const res = await create(common);
      expect(res.status, common).toBe(422);
      expect(await res.text()).toMatch(/common or breached/);
    }
  });

  it("a password of one repeated character is refused", async () => {
    const res = await create("a".repeat(20));
    expect(res.status).toBe(422);
    expect(await res.text()).toMatch(/one repeated character/);
  });

  it("a long unusual passphrase within 72 bytes is accepted", async () => {
    expect((await create("kettle-moraine-quartz-ledger-47")).status).toBe(201);
  });
});

describe("ASVS 2.1.6 — the password is changed only from a signed-in session", () => {
  it("an API token cannot change its user's password", async () => {
    const token = await tokenFor("viewer@tarnwell.example");
    const res = await callRoute(passwordRoute.POST, { url: "/api/v1/me/password", method: "POST", token, ...json({ currentPassword: "loopkeeper-demo", newPassword: "kettle-moraine-quartz-ledger-47" }) });
    expect(res.status).toBe(403);
    expect(await res.text()).toMatch(/API tokens cannot change it/);
  });
});
