// The package's own function modules rather than its index: screens that check versions then do
// not carry every semver function.
import compare from "semver/functions/compare";
import parse from "semver/functions/parse";
import satisfies from "semver/functions/satisfies";
import validRange from "semver/ranges/valid";

/**
 * Semantic Versioning 2.0.0 helpers over the `semver` package (semver.org
 * 2.0.0 §10–11: precedence by major, minor, patch, then pre-release
 * identifiers; build metadata ignored).
 */

/** True when `version` is a valid semantic version (no leading "v", no loose forms). */
export function isValidVersion(version: string): boolean {
  // semver.parse also takes a leading "v" or "=" and surrounding spaces; the registry does not.
  return typeof version === "string" && /^\d/.test(version) && !/\s/.test(version) && parse(version) !== null;
}

/** -1, 0 or 1 by semver precedence; never throws: invalid versions sort before valid ones. */
export function compareVersions(a: string, b: string): -1 | 0 | 1 {
  const va = isValidVersion(a);
  const vb = isValidVersion(b);
  if (!va || !vb) return va === vb ? 0 : va ? 1 : -1;
  return compare(a, b);
}

/** Versions sorted ascending by semver precedence (invalid ones first). */
export function sortVersions(versions: readonly string[]): string[] {
  return [...versions].sort(compareVersions);
}

/** Highest valid version, or undefined. */
export function latestVersion(versions: readonly string[]): string | undefined {
  return versions.filter(isValidVersion).sort(compareVersions).at(-1);
}

/** True when `range` is a valid semver range expression (e.g. ">=2.0.0 <3.0.0", "^2.1"). */
export function isValidRange(range: string): boolean {
  return typeof range === "string" && validRange(range) !== null;
}

/** True when `version` satisfies `range` (pre-releases only when the range names one, as `semver` does). */
export function satisfiesRange(version: string, range: string): boolean {
  return isValidVersion(version) && isValidRange(range) && satisfies(version, range);
}
