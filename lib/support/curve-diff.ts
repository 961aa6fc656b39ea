import type { CurveSettings, ProfileSettings } from "../profile/types";

/** One profile in a build slot, as the lookup compares them. */
export interface SlotProfile {
  profileId: string;
  profileName: string;
  version: string;
  settings: ProfileSettings;
}

export interface ProfileChange {
  profileId: string;
  profileName: string;
  /** Version shipped on the board, or null when the newer build adds the profile. */
  fromVersion: string | null;
  /** Version in the newer build, or null when the newer build drops the profile. */
  toVersion: string | null;
  kind: "changed" | "unchanged" | "added" | "removed";
  /** Plain-language differences, e.g. "pump: 45 °C 70 % → 65 %". */
  changes: string[];
}

const fmt = (n: number) => (Number.isInteger(n) ? String(n) : n.toFixed(1));

/** Point-by-point differences of one curve, matched by temperature. */
export function curvePointChanges(name: string, from: CurveSettings, to: CurveSettings): string[] {
  const out: string[] = [];
  const before = new Map(from.points.map((p) => [p.tempC, p.dutyPct]));
  const after = new Map(to.points.map((p) => [p.tempC, p.dutyPct]));
  for (const [t, d] of before) {
    const now = after.get(t);
    if (now === undefined) out.push(`${name}: point at ${fmt(t)} °C (${fmt(d)} %) removed`);
    else if (now !== d) out.push(`${name}: ${fmt(t)} °C ${fmt(d)} % → ${fmt(now)} %`);
  }
  for (const [t, d] of after) if (!before.has(t)) out.push(`${name}: point added at ${fmt(t)} °C (${fmt(d)} %)`);
  if (from.hysteresisC !== to.hysteresisC) out.push(`${name}: hysteresis ${fmt(from.hysteresisC)} → ${fmt(to.hysteresisC)} °C`);
  if (from.rampUpPctPerSec !== to.rampUpPctPerSec) out.push(`${name}: ramp-up ${fmt(from.rampUpPctPerSec)} → ${fmt(to.rampUpPctPerSec)} %/s`);
  if (from.rampDownPctPerSec !== to.rampDownPctPerSec) out.push(`${name}: ramp-down ${fmt(from.rampDownPctPerSec)} → ${fmt(to.rampDownPctPerSec)} %/s`);
  return out;
}

/** Differences between two versions of one profile's stored settings. */
export function profileSettingsChanges(from: ProfileSettings, to: ProfileSettings): string[] {
  const out: string[] = [];
  if (from.criticalTempC !== to.criticalTempC) out.push(`critical temperature ${fmt(from.criticalTempC)} → ${fmt(to.criticalTempC)} °C`);
  if (from.sensorLossDutyPct !== to.sensorLossDutyPct) out.push(`sensor-loss duty ${fmt(from.sensorLossDutyPct)} → ${fmt(to.sensorLossDutyPct)} %`);
  const stopFrom = from.fans.stopBelowTempC;
  const stopTo = to.fans.stopBelowTempC;
  if (stopFrom !== stopTo) {
    out.push(
      stopTo === undefined ? `fans no longer stop (stopped below ${fmt(stopFrom!)} °C)` : stopFrom === undefined ? `fans now stop below ${fmt(stopTo)} °C` : `fan stop ${fmt(stopFrom)} → ${fmt(stopTo)} °C`,
    );
  }
  out.push(...curvePointChanges("pump", from.pump, to.pump), ...curvePointChanges("fans", from.fans, to.fans));
  return out;
}

/**
 * What changed between the profiles a board shipped with and those of a newer build,
 * matched by profile (not by slot position, which a build may reorder).
 */
export function diffBuildProfiles(shipped: readonly SlotProfile[], newer: readonly SlotProfile[]): ProfileChange[] {
  const out: ProfileChange[] = [];
  const newerById = new Map(newer.map((p) => [p.profileId, p]));
  for (const old of shipped) {
    const next = newerById.get(old.profileId);
    if (!next) {
      out.push({ profileId: old.profileId, profileName: old.profileName, fromVersion: old.version, toVersion: null, kind: "removed", changes: [] });
      continue;
    }
    const changes = profileSettingsChanges(old.settings, next.settings);
    const kind = changes.length === 0 && old.version === next.version ? "unchanged" : "changed";
    out.push({ profileId: old.profileId, profileName: old.profileName, fromVersion: old.version, toVersion: next.version, kind, changes });
  }
  const shippedIds = new Set(shipped.map((p) => p.profileId));
  for (const p of newer) {
    if (!shippedIds.has(p.profileId)) out.push({ profileId: p.profileId, profileName: p.profileName, fromVersion: null, toVersion: p.version, kind: "added", changes: [] });
  }
  return out;
}
