import { describe, expect, it } from "vitest";
import { diffBuildProfiles, profileSettingsChanges } from "@/lib/support/curve-diff";
import type { ProfileSettings } from "@/lib/engine";

// The diff is the product's own summary (no external reference): checks compare
// hand-built settings that differ in exactly the named ways.
const base: ProfileSettings = {
  criticalTempC: 60,
  sensorLossDutyPct: 100,
  pump: { points: [{ tempC: 20, dutyPct: 40 }, { tempC: 45, dutyPct: 70 }, { tempC: 55, dutyPct: 100 }], hysteresisC: 2, rampUpPctPerSec: 5, rampDownPctPerSec: 2 },
  fans: { points: [{ tempC: 30, dutyPct: 25 }, { tempC: 58, dutyPct: 100 }], hysteresisC: 1.5, rampUpPctPerSec: 5, rampDownPctPerSec: 2, stopBelowTempC: 30 },
};

describe("curve diff summary", () => {
  it("reports nothing for identical settings", () => {
    expect(profileSettingsChanges(base, structuredClone(base))).toEqual([]);
  });
  it("names changed, added and removed points and settings", () => {
    const next = structuredClone(base);
    next.pump.points[1] = { tempC: 45, dutyPct: 65 };
    next.fans.points.splice(1, 0, { tempC: 40, dutyPct: 45 });
    next.fans.stopBelowTempC = undefined;
    next.criticalTempC = 62;
    const changes = profileSettingsChanges(base, next);
    expect(changes).toContain("pump: 45 °C 70 % → 65 %");
    expect(changes).toContain("fans: point added at 40 °C (45 %)");
    expect(changes).toContain("fans no longer stop (stopped below 30 °C)");
    expect(changes).toContain("critical temperature 60 → 62 °C");
    expect(changes).toHaveLength(4);
  });
  it("matches slots by profile and reports added and removed profiles", () => {
    const next = structuredClone(base);
    next.pump.hysteresisC = 3;
    const diff = diffBuildProfiles(
      [
        { profileId: "a", profileName: "Quiet", version: "1.0.0", settings: base },
        { profileId: "b", profileName: "Balanced", version: "1.0.0", settings: base },
      ],
      [
        { profileId: "c", profileName: "Turbo", version: "1.0.0", settings: base },
        { profileId: "a", profileName: "Quiet", version: "1.1.0", settings: next },
      ],
    );
    expect(diff.map((d) => [d.profileName, d.kind, d.fromVersion, d.toVersion])).toEqual([
      ["Quiet", "changed", "1.0.0", "1.1.0"],
      ["Balanced", "removed", "1.0.0", null],
      ["Turbo", "added", null, "1.0.0"],
    ]);
    expect(diff[0]!.changes).toEqual(["pump: hysteresis 2 → 3 °C"]);
  });
});
