import { describe, expect, it } from "vitest";
import { compareVersions, isRevisionCompatible, isValidRange, isValidVersion, latestVersion, sortVersions, suggestNextVersion } from "@/lib/engine";
import { quietProfile } from "./fixtures";

describe("semver precedence", () => {
  it("orders the semver.org example list", () => {
    // semver.org, Semantic Versioning 2.0.0, §11 (precedence examples).
    const ordered = ["1.0.0-alpha", "1.0.0-alpha.1", "1.0.0-alpha.beta", "1.0.0-beta", "1.0.0-beta.2", "1.0.0-beta.11", "1.0.0-rc.1", "1.0.0", "2.0.0", "2.1.0", "2.1.1"];
    const shuffled = [...ordered].reverse();
    shuffled.push(shuffled.shift()!);
    expect(sortVersions(shuffled)).toEqual(ordered);
    for (let i = 1; i < ordered.length; i++) expect(compareVersions(ordered[i - 1]!, ordered[i]!)).toBe(-1);
  });

  it("ignores build metadata for precedence", () => {
    // semver.org, Semantic Versioning 2.0.0, §10.
    expect(compareVersions("1.0.0+build.1", "1.0.0+build.2")).toBe(0);
    expect(isValidVersion("1.0.0+20130313144700")).toBe(true);
  });

  it("rejects non-versions without throwing", () => {
    for (const v of ["v1.0.0", "1.0", "01.0.0", " 1.0.0", "", "1.0.0.0"]) expect(isValidVersion(v)).toBe(false);
    expect(compareVersions("nope", "1.0.0")).toBe(-1);
    expect(latestVersion(["1.2.0", "x", "1.10.0", "1.9.9"])).toBe("1.10.0");
    expect(isValidRange(">=2.0.0 <3.0.0")).toBe(true);
    expect(isValidRange("not a range")).toBe(false);
  });
});

describe("suggestNextVersion", () => {
  it("patch when only the name or description changes, or nothing", () => {
    const a = quietProfile();
    expect(suggestNextVersion(a, { ...a, description: "new words" }, "1.4.2")).toMatchObject({ version: "1.4.3", bump: "patch" });
    expect(suggestNextVersion(a, a, "1.4.2").version).toBe("1.4.3");
  });

  it("minor when curve points, hysteresis or ramps change", () => {
    const a = quietProfile();
    const b = quietProfile();
    b.fans.points[1]!.dutyPct = 45;
    expect(suggestNextVersion(a, b, "1.4.2")).toMatchObject({ version: "1.5.0", bump: "minor", reasons: ["fans curve changed"] });
    const c = quietProfile();
    c.pump.rampUpPctPerSec = 10;
    expect(suggestNextVersion(a, c, "1.4.2").bump).toBe("minor");
  });

  it("major when the safety envelope or slot layout changes", () => {
    const a = quietProfile();
    const cases: ((p: ReturnType<typeof quietProfile>) => void)[] = [
      (p) => (p.criticalTempC = 58),
      (p) => (p.sensorLossDutyPct = 99),
      (p) => delete p.fans.stopBelowTempC,
      (p) => p.pump.points.splice(1, 1),
    ];
    for (const change of cases) {
      const b = quietProfile();
      change(b);
      expect(suggestNextVersion(a, b, "1.4.2")).toMatchObject({ version: "2.0.0", bump: "major" });
    }
  });

  it("leaves a pre-release for its release, and gives null for a bad previous version", () => {
    const a = quietProfile();
    const b = { ...a, criticalTempC: 59 };
    expect(suggestNextVersion(a, b, "2.0.0-rc.1").version).toBe("2.0.0");
    expect(suggestNextVersion(a, b, "banana").version).toBeNull();
  });
});

describe("isRevisionCompatible", () => {
  it("needs the version in range and the image within memory", () => {
    expect(isRevisionCompatible({ revisionVersion: "2.1.0", range: ">=2.0.0 <3.0.0", imageBytes: 100, memoryBytes: 256 })).toEqual({ ok: true, reasons: [] });
    const out = isRevisionCompatible({ revisionVersion: "3.0.0", range: "^2.0.0", imageBytes: 300, memoryBytes: 256 });
    expect(out.ok).toBe(false);
    expect(out.reasons).toHaveLength(2);
    expect(out.reasons.join(" ")).toMatch(/outside the range.*300 bytes/);
  });

  it("reports bad input as reasons", () => {
    const out = isRevisionCompatible({ revisionVersion: "two", range: "%%", imageBytes: Number.NaN, memoryBytes: 1 });
    expect(out.ok).toBe(false);
    expect(out.reasons).toHaveLength(3);
    expect(isRevisionCompatible(undefined as never).ok).toBe(false);
  });
});
