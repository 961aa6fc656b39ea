import { contentHashHex, crc32, encodeBank, isRevisionCompatible, satisfiesRange, validateProfileText, type CoolingProfile, type HardwareContext, type ValidationIssue } from "@/lib/engine";
import { toHardwareContext, type ComponentFields, type CoolerFields, type RevisionFields } from "./hardware-context";
import { rangeFitMessage } from "./range-fit";
import { fitRange } from "./range-match";

export interface VersionImage {
  document: CoolingProfile;
  /** Bytes of a bank image holding this version alone (header, slot, CRC trailer). */
  encodedBytes: number;
  /** CRC-32 trailer of that image. */
  crc32: number;
  /** SHA-256 of the canonical JSON, hex. */
  contentHash: string;
  warnings: ValidationIssue[];
}

export type VersionImageResult = { ok: true; image: VersionImage } | { ok: false; message: string; issues: ValidationIssue[] };

/**
 * What publishing a version computes: the document validated against the cooler's
 * parts on the most capable board revision the range admits, encoded alone into a bank
 * image for its size and CRC, and hashed; then every revision the range admits must
 * hold it (points per curve, memory, a slot), or the version is refused naming each
 * revision that cannot, with the narrowest range that fits. Pure, so the server and
 * the demo seed agree.
 */
export function buildVersionImage(input: {
  text: string;
  version: string;
  boardRange: string;
  cooler: CoolerFields;
  fan: ComponentFields;
  pump: ComponentFields;
  revisions: RevisionFields[];
}): VersionImageResult {
  const inRange = input.revisions.filter((r) => satisfiesRange(r.revision, input.boardRange));
  if (inRange.length === 0) {
    const known = input.revisions.map((r) => r.revision).join(", ") || "none";
    return { ok: false, message: `No board revision of this cooler's board satisfies "${input.boardRange}" (known: ${known}); widen the range.`, issues: [] };
  }
  const largest = inRange.reduce((a, b) => (b.memoryBytes > a.memoryBytes || (b.memoryBytes === a.memoryBytes && b.maxPointsPerCurve > a.maxPointsPerCurve) ? b : a));
  const hw: HardwareContext = toHardwareContext({ cooler: input.cooler, fan: input.fan, pump: input.pump, revision: largest });
  const result = validateProfileText(input.text, hw);
  if (!result.ok || !result.value) {
    return { ok: false, message: `The document is not valid for ${hw.name}; fix the listed problems.`, issues: result.issues.filter((i) => i.severity === "error") };
  }
  const document = result.value;
  const contentHash = contentHashHex(document);
  const encoded = encodeBank([{ profile: document, version: input.version, contentHashHex: contentHash }]);
  if (!encoded.ok) {
    return { ok: false, message: "The version could not be encoded for the board.", issues: encoded.errors.map((e) => ({ code: e.code, path: "", severity: "error", message: e.message })) };
  }
  const bytes = encoded.bytes;
  const fit = fitRange(input.boardRange, input.revisions, { pointsPerCurve: Math.max(document.pump.points.length, document.fans.points.length), encodedBytes: bytes.length });
  if (fit.misfits.length > 0) {
    return {
      ok: false,
      message: rangeFitMessage(input.boardRange, fit),
      issues: fit.misfits.map((m) => ({ code: "range.revision_cannot_hold", path: "/boardRange", severity: "error" as const, message: `Revision ${m.revision}: ${m.reasons.join("; ")}.` })),
    };
  }
  return {
    ok: true,
    image: { document, encodedBytes: bytes.length, crc32: crc32(bytes, 0, 0, bytes.length - 4), contentHash, warnings: result.issues.filter((i) => i.severity === "warning") },
  };
}

export interface MatrixVersion {
  version: string;
  boardRange: string;
  encodedBytes: number;
  /** Points of the longer of the two curves. */
  maxPointsPerCurve: number;
}

/**
 * One cell per board revision: compatible when the range is satisfied and the image
 * fits memory (isRevisionCompatible), and the board can hold that many points per curve.
 */
export function compatibilityCells(v: MatrixVersion, revisions: readonly { id: string; revision: string; memoryBytes: number; maxPointsPerCurve: number }[]) {
  return revisions.map((r) => {
    const base = isRevisionCompatible({ revisionVersion: r.revision, range: v.boardRange, imageBytes: v.encodedBytes, memoryBytes: r.memoryBytes });
    const reasons = [...base.reasons];
    if (v.maxPointsPerCurve > r.maxPointsPerCurve) reasons.push(`A curve has ${v.maxPointsPerCurve} points; revision ${r.revision} stores at most ${r.maxPointsPerCurve}.`);
    return { revisionId: r.id, ok: reasons.length === 0, reasons };
  });
}
