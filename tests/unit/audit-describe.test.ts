import { describe, expect, it } from "vitest";
import { auditSentence, auditSubject, userChangeActions } from "@/lib/audit/describe";
import { auditRangeBound } from "@/lib/audit/range";
import { formatUtc } from "@/lib/time/format";

const event = (action: string, before: unknown = null, after: unknown = null) => ({ action, entityType: "build", entityId: "0b6d4c1e-0000-4000-8000-000000000000", before, after });

describe("audit events as people read them", () => {
  it("names a profile version with its version and links to its row in the version history", () => {
    const s = auditSubject({ entityType: "profile_version", id: "pv", profileId: "p1", profileName: "Balanced", version: "1.1.0" });
    expect(s).toEqual({ label: "Balanced 1.1.0", href: "/profiles/p1#version-1.1.0" });
    expect(auditSentence("Teodor Quist", { ...event("profile_version.publish"), entityType: "profile_version" }, s)).toBe("Teodor Quist published Balanced 1.1.0");
  });

  it("says where a build moved, in the stage names the screens use", () => {
    const s = auditSubject({ entityType: "build", id: "b1", boardModelName: "TC-1", version: "3.1.0" });
    expect(s.href).toBe("/builds/b1");
    expect(auditSentence("Sunniva Kalt", event("build.promote", { stage: "review" }, { stage: "validation" }), s)).toBe("Sunniva Kalt moved TC-1 build 3.1.0 to Lab validation");
    expect(auditSentence("Sunniva Kalt", event("build.withdraw", { stage: "pilot" }, { stage: "withdrawn" }), s)).toBe("Sunniva Kalt withdrew TC-1 build 3.1.0");
  });

  it("links a lot to the lots list filtered by its code", () => {
    expect(auditSubject({ entityType: "production_lot", id: "l1", lotCode: "TW 25/01" })).toEqual({ label: "lot TW 25/01", href: "/lots?code=TW%2025%2F01" });
  });

  it("still reads when the changed thing is gone", () => {
    expect(auditSentence("Ilse Brandvold", event("build.create"), null)).toBe("Ilse Brandvold created build 0b6d4c1e");
  });

  it("names a lot that is no longer recorded by the code the event kept, not by an id", () => {
    const lot = { ...event("lot.import", null, { lotCode: "TW-2507", serialFrom: 40000 }), entityType: "production_lot" };
    expect(auditSentence("Sunniva Kalt", lot, null)).toBe("Sunniva Kalt imported lot TW-2507");
    expect(auditSentence("Sunniva Kalt", { ...lot, action: "lot.create", after: null, before: { lotCode: "TW-2508" } }, null)).toBe("Sunniva Kalt created lot TW-2508");
  });

  it("gives each kind of account change its own action", () => {
    const t = new Date("2026-01-01T00:00:00Z");
    expect(userChangeActions({ role: "viewer", disabledAt: null }, { role: "support", disabledAt: null })).toEqual(["user.role_change"]);
    expect(userChangeActions({ role: "viewer", disabledAt: null }, { role: "viewer", disabledAt: t })).toEqual(["user.disable"]);
    expect(userChangeActions({ role: "viewer", disabledAt: t }, { role: "viewer", disabledAt: null })).toEqual(["user.enable"]);
    expect(userChangeActions({ role: "viewer", disabledAt: null }, { role: "admin", disabledAt: t })).toEqual(["user.role_change", "user.disable"]);
    expect(userChangeActions({ role: "viewer", disabledAt: null }, { role: "viewer", disabledAt: null })).toEqual([]);
  });
});

describe("times and day ranges", () => {
  it("writes UTC with its zone named", () => {
    // RFC 3339 §5.8 example instant 1990-12-31T15:59:60-08:00 is leap-second; its neighbour 1985-04-12T23:20:50.52Z is used.
    expect(formatUtc("1985-04-12T23:20:50.52Z")).toBe("1985-04-12 23:20 UTC");
    expect(formatUtc("1985-04-12T23:20:50.52Z", "second")).toBe("1985-04-12 23:20:50 UTC");
    // An offset is converted, not dropped: 1996-12-19T16:39:57-08:00 (RFC 3339 §5.8) is 1996-12-20 00:39:57 UTC.
    expect(formatUtc("1996-12-19T16:39:57-08:00", "second")).toBe("1996-12-20 00:39:57 UTC");
  });

  it("takes a bare day as the whole UTC day", () => {
    expect(auditRangeBound("2026-03-01", "from")?.toISOString()).toBe("2026-03-01T00:00:00.000Z");
    expect(auditRangeBound("2026-03-01", "to")?.toISOString()).toBe("2026-03-01T23:59:59.999Z");
    expect(auditRangeBound("2026-03-01T10:00:00+02:00", "to")?.toISOString()).toBe("2026-03-01T08:00:00.000Z");
    expect(auditRangeBound(undefined, "from")).toBeUndefined();
  });
});
