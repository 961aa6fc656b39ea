import type { DecodedSlot } from "./types";

/** A profile version the registry knows, to match dumps against. */
export interface KnownProfileVersion {
  profileVersionId: string;
  /** Hex of the content hash, or at least its first 16 hex digits. */
  contentHashPrefix: string;
  version: string;
}

export interface SlotIdentity {
  slotIndex: number;
  contentHashPrefix: string;
  version: string;
  /**
   * exact: content hash and version both match a known profile version.
   * hash_only: the content matches but the stored version differs.
   * unknown: no known profile version has this content.
   */
  match: "exact" | "hash_only" | "unknown";
  profileVersionId?: string;
  /** For hash_only: the version the registry has for this content. */
  knownVersion?: string;
}

/**
 * Matches decoded slots against known profile versions by the first 8 bytes of
 * their content hash (16 hex digits, case-insensitive), then by version.
 */
export function identifySlots(slots: readonly DecodedSlot[], known: readonly KnownProfileVersion[]): SlotIdentity[] {
  const byPrefix = new Map<string, KnownProfileVersion[]>();
  for (const k of known) {
    if (typeof k?.contentHashPrefix !== "string" || typeof k.version !== "string") continue;
    const prefix = k.contentHashPrefix.slice(0, 16).toLowerCase();
    byPrefix.set(prefix, [...(byPrefix.get(prefix) ?? []), k]);
  }
  return slots.map((slot) => {
    const base = { slotIndex: slot.index, contentHashPrefix: slot.contentHashPrefix, version: slot.version };
    const candidates = byPrefix.get(slot.contentHashPrefix.toLowerCase()) ?? [];
    const exact = candidates.find((k) => k.version === slot.version);
    if (exact) return { ...base, match: "exact", profileVersionId: exact.profileVersionId };
    const first = candidates[0];
    if (first) return { ...base, match: "hash_only", profileVersionId: first.profileVersionId, knownVersion: first.version };
    return { ...base, match: "unknown" };
  });
}
