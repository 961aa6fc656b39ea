import inc from "semver/functions/inc";
import { canonicalJson } from "../profile/canonical";
import type { CoolingProfile, CurveSettings } from "../profile/types";
import { isValidVersion } from "./semver-helpers";

export type VersionBump = "major" | "minor" | "patch";

export interface VersionSuggestion {
  /** Suggested next version, or null when `prevVersion` is not a valid semantic version. */
  version: string | null;
  bump: VersionBump;
  /** One line per change found, most significant first. */
  reasons: string[];
}

const curveShape = (c: CurveSettings): string => canonicalJson({ points: c.points, hysteresisC: c.hysteresisC, rampUpPctPerSec: c.rampUpPctPerSec, rampDownPctPerSec: c.rampDownPctPerSec });

/**
 * Suggests the next version of a profile from what changed between two
 * documents. The rule (also in docs/versioning.md):
 *
 * - major — the safety envelope or stored layout changes, so a reviewer must
 *   look again and a board or tool that relied on the old behaviour may not:
 *   formatVersion changed; criticalTempC changed; sensorLossDutyPct changed;
 *   fan stop added or removed; a curve's point count changed (its slot size
 *   changes, it may no longer fit a board revision).
 * - minor — the curves' behaviour changes within the same envelope and slot
 *   size: any point's temperature or duty, hysteresis, ramp limits, or the
 *   fan stop temperature (fan stop kept).
 * - patch — nothing the board stores changed: name, description, $schema, or
 *   nothing at all (a new version still needs a new number).
 *
 * The next version comes from `semver.inc`, so 1.4.2 → 2.0.0 / 1.5.0 / 1.4.3,
 * and a pre-release such as 2.0.0-rc.1 with a major bump becomes 2.0.0.
 */
export function suggestNextVersion(prev: CoolingProfile, next: CoolingProfile, prevVersion: string): VersionSuggestion {
  const major: string[] = [];
  const minor: string[] = [];
  const patch: string[] = [];
  if (prev.formatVersion !== next.formatVersion) major.push(`format version ${String(prev.formatVersion)} → ${String(next.formatVersion)}`);
  if (prev.criticalTempC !== next.criticalTempC) major.push(`critical temperature ${prev.criticalTempC} → ${next.criticalTempC} °C`);
  if (prev.sensorLossDutyPct !== next.sensorLossDutyPct) major.push(`sensor-loss duty ${prev.sensorLossDutyPct} → ${next.sensorLossDutyPct} %`);
  const prevStop = prev.fans.stopBelowTempC;
  const nextStop = next.fans.stopBelowTempC;
  if ((prevStop === undefined) !== (nextStop === undefined)) major.push(nextStop === undefined ? "fan stop removed" : "fan stop added");
  else if (prevStop !== nextStop) minor.push(`fan stop temperature ${prevStop} → ${nextStop} °C`);
  for (const kind of ["pump", "fans"] as const) {
    const a = prev[kind];
    const b = next[kind];
    if (a.points.length !== b.points.length) major.push(`${kind} curve point count ${a.points.length} → ${b.points.length}`);
    else if (curveShape(a) !== curveShape(b)) minor.push(`${kind} curve changed`);
  }
  if (prev.name !== next.name) patch.push("name changed");
  if ((prev.description ?? "") !== (next.description ?? "")) patch.push("description changed");
  if ((prev.$schema ?? "") !== (next.$schema ?? "")) patch.push("$schema changed");

  const bump: VersionBump = major.length > 0 ? "major" : minor.length > 0 ? "minor" : "patch";
  const reasons = [...major, ...minor, ...patch];
  if (reasons.length === 0) reasons.push("no changes found; a new version still needs a new number");
  const version = isValidVersion(prevVersion) ? inc(prevVersion, bump) : null;
  return { version, bump, reasons };
}
