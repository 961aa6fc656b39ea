/**
 * The one version rule for what a board stores (profile versions in a bank slot, build
 * versions): three numbers, each one byte (0–255), written without leading zeros, with no
 * pre-release or build suffix (docs/bank-format.md). Forms, the API schemas, the publish
 * use case and the bank encoder all ask here.
 */
const STORED_VERSION_RE = /^(0|[1-9]\d{0,2})\.(0|[1-9]\d{0,2})\.(0|[1-9]\d{0,2})$/;

/** The three parts of a storable version, or null when a board could not store it. */
export function storedVersionParts(version: string): [number, number, number] | null {
  const m = STORED_VERSION_RE.exec(version);
  if (!m) return null;
  const parts = [Number(m[1]), Number(m[2]), Number(m[3])] as [number, number, number];
  return parts.every((p) => p <= 255) ? parts : null;
}

export function isStoredVersion(version: string): boolean {
  return storedVersionParts(version) !== null;
}

/** How to write one, for messages. */
export const STORED_VERSION_HINT = "three numbers, each 0–255, such as 1.2.0 (no pre-release or build suffix)";
