import { bankBytes, crc32, encodeBank, satisfiesRange, sha256, toHex, validateProfile, type CoolingProfile } from "../engine";
import { toHardwareContext, type ComponentFields, type CoolerFields, type RevisionFields } from "../registry/hardware-context";

/** One profile version placed in a build slot, with the cooler it was written for. */
export interface BuildSlotFacts {
  /** How people name it, e.g. "Low noise 1.2.0". */
  label: string;
  document: unknown;
  version: string;
  boardRange: string;
  contentHash: string;
  cooler: CoolerFields;
  fan: ComponentFields;
  pump: ComponentFields;
}

export type BuildCheck =
  | { ok: true; image: Uint8Array; bankBytes: number; sha256: string; /** The CRC-32 trailer the board checks (all bytes before it). */ crc32: number; revisions: string[] }
  | { ok: false; issues: string[]; revisions: string[] };

/**
 * Every engine check a build must pass: each slot's document re-validated against each
 * board revision in the range (schema, semantic rules, point limits), each profile
 * version's board range satisfied by each revision, the slot count and memory of the
 * smallest revision respected; then the bank image encoded (CRC-32 trailer, SHA-256).
 */
export function checkBuild(input: { revisionRange: string; revisions: readonly RevisionFields[]; slots: readonly BuildSlotFacts[] }): BuildCheck {
  const inRange = input.revisions.filter((r) => satisfiesRange(r.revision, input.revisionRange));
  const revisions = inRange.map((r) => r.revision);
  const issues: string[] = [];
  if (inRange.length === 0) issues.push(`No revision of this board model is in the range "${input.revisionRange}".`);
  if (input.slots.length === 0) issues.push("Put at least one profile version in a slot.");

  input.slots.forEach((slot, i) => {
    const name = `Slot ${i + 1} (${slot.label})`;
    for (const rev of inRange) {
      if (!satisfiesRange(rev.revision, slot.boardRange)) {
        issues.push(`${name} is for board revisions ${slot.boardRange}; revision ${rev.revision} is in the build's range but not in it.`);
        continue;
      }
      const doc = slot.document as Partial<CoolingProfile> | null;
      const points = Math.max(doc?.pump?.points?.length ?? 0, doc?.fans?.points?.length ?? 0);
      if (points > rev.maxPointsPerCurve) {
        issues.push(`${name} has a curve of ${points} points; revision ${rev.revision} holds at most ${rev.maxPointsPerCurve} (${points - rev.maxPointsPerCurve} over).`);
        continue;
      }
      const result = validateProfile(slot.document, toHardwareContext({ cooler: slot.cooler, fan: slot.fan, pump: slot.pump, revision: rev }));
      for (const issue of result.issues) {
        if (issue.severity === "error") issues.push(`${name} on revision ${rev.revision}: ${issue.message}${issue.path ? ` (at ${issue.path})` : ""}`);
      }
    }
  });
  if (issues.length > 0) return { ok: false, issues: [...new Set(issues)], revisions };

  const docs = input.slots.map((s) => s.document as CoolingProfile);
  const size = bankBytes(docs.map((d) => ({ pumpPoints: d.pump.points.length, fanPoints: d.fans.points.length })));
  const smallestMemory = inRange.reduce((a, b) => (b.memoryBytes < a.memoryBytes ? b : a));
  const fewestSlots = inRange.reduce((a, b) => (b.slotCount < a.slotCount ? b : a));
  if (input.slots.length > fewestSlots.slotCount) {
    issues.push(`The build has ${input.slots.length} slots; revision ${fewestSlots.revision} has ${fewestSlots.slotCount} (${input.slots.length - fewestSlots.slotCount} too many).`);
  }
  if (size > smallestMemory.memoryBytes) {
    issues.push(`The bank image takes ${size} bytes; revision ${smallestMemory.revision} has ${smallestMemory.memoryBytes} bytes of profile memory (${size - smallestMemory.memoryBytes} bytes over).`);
  }
  if (issues.length > 0) return { ok: false, issues, revisions };

  const encoded = encodeBank(input.slots.map((s, i) => ({ profile: docs[i]!, version: s.version, contentHashHex: s.contentHash })));
  if (!encoded.ok) return { ok: false, issues: encoded.errors.map((e) => e.message), revisions };
  return { ok: true, image: encoded.bytes, bankBytes: encoded.bytes.length, sha256: toHex(sha256(encoded.bytes)), crc32: crc32(encoded.bytes, 0, 0, encoded.bytes.length - 4), revisions };
}
