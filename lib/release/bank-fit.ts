import { CRC_BYTES, HEADER_BYTES } from "../bank/layout";

/**
 * Bytes of a bank holding these profile versions, from each version's own image. A version's
 * image is a one-slot bank (header + slot + CRC, docs/bank-format.md), so a bank of several
 * is one header and one CRC around all their slots.
 */
export function bankBytesFromVersionImages(imageBytes: readonly number[]): number {
  if (imageBytes.length === 0) return 0;
  return HEADER_BYTES + imageBytes.reduce((sum, b) => sum + (b - HEADER_BYTES - CRC_BYTES), 0) + CRC_BYTES;
}

export interface RevisionFit {
  revision: string;
  memoryBytes: number;
  slotCount: number;
  /** Bytes left over (negative: short by that many). */
  spareBytes: number;
  fitsMemory: boolean;
  fitsSlots: boolean;
}

/** How a bank of `slots` slots and `bankBytes` bytes fits each board revision's profile memory and slot count. */
export function fitToRevisions(bankBytes: number, slots: number, revisions: readonly { revision: string; memoryBytes: number; slotCount: number }[]): RevisionFit[] {
  return revisions.map((r) => ({
    revision: r.revision,
    memoryBytes: r.memoryBytes,
    slotCount: r.slotCount,
    spareBytes: r.memoryBytes - bankBytes,
    fitsMemory: bankBytes <= r.memoryBytes,
    fitsSlots: slots <= r.slotCount,
  }));
}
