import { isValidRange, isValidVersion, satisfiesRange } from "./semver-helpers";

export interface RevisionCompatibilityInput {
  /** Board revision, e.g. "2.1.0". */
  revisionVersion: string;
  /** The profile version's compatible board revision range, e.g. ">=2.0.0 <3.0.0". */
  range: string;
  /** Size of the bank image to flash, bytes. */
  imageBytes: number;
  /** Profile memory of the board revision, bytes. */
  memoryBytes: number;
}

export interface RevisionCompatibility {
  ok: boolean;
  /** Why not, one sentence each; empty when ok. */
  reasons: string[];
}

/**
 * A board revision is compatible when its version satisfies the range
 * (semver range rules of the `semver` package) and the bank image fits its
 * profile memory (imageBytes ≤ memoryBytes). Never throws.
 */
export function isRevisionCompatible(input: RevisionCompatibilityInput): RevisionCompatibility {
  const reasons: string[] = [];
  const { revisionVersion, range, imageBytes, memoryBytes } = input ?? ({} as RevisionCompatibilityInput);
  const versionOk = isValidVersion(revisionVersion);
  const rangeOk = isValidRange(range);
  if (!versionOk) reasons.push(`"${String(revisionVersion)}" is not a semantic version such as 2.1.0.`);
  if (!rangeOk) reasons.push(`"${String(range)}" is not a valid version range such as ">=2.0.0 <3.0.0".`);
  if (versionOk && rangeOk && !satisfiesRange(revisionVersion, range)) reasons.push(`Revision ${revisionVersion} is outside the range ${range}.`);
  const sizesOk = Number.isInteger(imageBytes) && imageBytes >= 0 && Number.isInteger(memoryBytes) && memoryBytes >= 0;
  if (!sizesOk) reasons.push("Image and memory sizes must be whole numbers of bytes.");
  else if (imageBytes > memoryBytes) reasons.push(`The bank image takes ${imageBytes} bytes but the revision has ${memoryBytes}.`);
  return { ok: reasons.length === 0, reasons };
}
