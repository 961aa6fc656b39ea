import { describe, expect, it } from "vitest";
import { can, isRole, ROLES } from "@/lib/auth/roles";

describe("roles", () => {
  it("admin can do everything, viewer only read", () => {
    for (const cap of ["read", "registry:write", "build:promote", "lot:write", "support", "admin"] as const) expect(can("admin", cap)).toBe(true);
    expect(ROLES.filter((r) => can(r, "read"))).toEqual([...ROLES]);
    expect(["registry:write", "build:create", "build:review", "build:promote", "build:withdraw", "lot:write", "support", "admin"].some((c) => can("viewer", c as never))).toBe(false);
  });

  it("only release managers and admins move builds past review or withdraw them", () => {
    expect(ROLES.filter((r) => can(r, "build:promote"))).toEqual(["admin", "release_manager"]);
    expect(ROLES.filter((r) => can(r, "build:withdraw"))).toEqual(["admin", "release_manager"]);
  });

  it("no role at all can do nothing", () => {
    expect(can(null, "read")).toBe(false);
    expect(isRole("root")).toBe(false);
    expect(isRole("support")).toBe(true);
  });
});
