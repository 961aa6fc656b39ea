import { sha256, toHex } from "../checksums/sha256";
import type { HardwareContext } from "../hardware/types";
import type { CurveSettings, ProfileSettings } from "../profile/types";
import { validateProfile } from "../validation/validate";
import type { IssueSeverity } from "../validation/types";
import { decodeBank } from "./decode";
import { encodeBank } from "./encode";
import { CRC_BYTES, HEADER_BYTES } from "./layout";
import { quantise } from "./quantise";
import type { DecodeBankResult, DecodedSlot } from "./types";

/** A published profile version, as the registry stores it. */
export interface RegistryVersion {
  profileVersionId: string;
  version: string;
  /** Hex SHA-256 of the stored document's canonical JSON (the slot keeps its first 8 bytes). */
  contentHash: string;
  /** The stored document; its encoding is what an untouched slot must equal byte for byte. */
  document: ProfileSettings;
  profileName?: string;
  coolerName?: string;
  /** The cooler the version was published for, so decoded slots meet its pump and fan limits. */
  hardware?: HardwareContext;
}

/** A build whose bank image the registry keeps, by the image's SHA-256. */
export interface RegistryBuild {
  buildId: string;
  version: string;
  stage: string;
  boardModelName?: string;
  /** Lower-case hex SHA-256 of the whole bank image. */
  bankSha256: string;
  /** The Ed25519 signature made when the build entered pilot, when it has one. */
  bankSignature?: { keyId: string; signature: Uint8Array };
}

/**
 * exact: the slot's bytes equal the registry's encoding of that version.
 * altered: it names a registry version (by its content label) but its bytes differ.
 * unknown: no registry version carries its content label.
 * undecodable: the slot's bytes cannot be read as a slot.
 */
export type SlotMatch = "exact" | "altered" | "unknown" | "undecodable";

/** A safety or limit finding of the authoring rules on a decoded slot. */
export interface SlotFinding {
  code: string;
  severity: IssueSeverity;
  message: string;
}

export interface SlotReport {
  slotIndex: number;
  /** Byte offset of the slot in the image. */
  offset: number;
  match: SlotMatch;
  /** As stored in the slot (absent when undecodable). */
  version?: string;
  contentHashPrefix?: string;
  /** The registry version the slot was compared with. */
  profileVersionId?: string;
  knownVersion?: string;
  profileName?: string;
  coolerName?: string;
  /** For "altered": each differing field in the trade's units, e.g. "pump point 3: 62 % here, 65 % in v1.1.0". */
  differences: string[];
  /** For "undecodable": why. */
  reason?: string;
  /** The authoring rules applied to what the slot holds; errors are faults. */
  findings: SlotFinding[];
}

/** The bank bytes of a dump and the keys the registry is searched by. */
export interface DumpKeys {
  /** Content-label prefixes (16 hex digits) of the readable slots. */
  hashPrefixes: string[];
  /** SHA-256 of the image (header to CRC) when the header could be read. */
  imageSha256?: string;
}

/** The image part of a dump: header to CRC inclusive, when the header gives a usable length. */
export function imageBytes(bytes: Uint8Array, decoded: DecodeBankResult): Uint8Array | undefined {
  const n = decoded.byteLength;
  return n !== undefined && decoded.crc && n <= bytes.length ? bytes.subarray(0, n) : undefined;
}

/** Lower-case hex SHA-256 (FIPS 180-4) of an image. */
export const imageSha256 = (image: Uint8Array): string => toHex(sha256(image));

/** What to look up in the registry for a dump: slot content labels and the image hash. */
export function dumpKeys(bytes: Uint8Array): DumpKeys {
  const decoded = decodeBank(bytes);
  const image = imageBytes(bytes, decoded);
  return { hashPrefixes: [...new Set(decoded.slots.map((s) => s.contentHashPrefix))], ...(image ? { imageSha256: imageSha256(image) } : {}) };
}

/**
 * The slot bytes the registry encodes for a version: the stored document
 * quantised and laid out as in docs/bank-format.md, with the stored content
 * hash and version. Null when the stored document no longer encodes.
 */
export function registrySlotBytes(known: RegistryVersion): Uint8Array | null {
  const r = encodeBank([{ profile: known.document, version: known.version, contentHashHex: known.contentHash }]);
  return r.ok ? r.bytes.subarray(HEADER_BYTES, r.bytes.length - CRC_BYTES) : null;
}

const sameBytes = (a: Uint8Array, b: Uint8Array): boolean => a.length === b.length && a.every((x, i) => x === b[i]);
const num = (n: number): string => String(Math.round(n * 100) / 100);

function curveDifferences(name: string, here: CurveSettings, there: CurveSettings, ref: string, out: string[]): void {
  if (here.points.length !== there.points.length) out.push(`${name} curve: ${here.points.length} points here, ${there.points.length} in ${ref}`);
  const n = Math.min(here.points.length, there.points.length);
  for (let i = 0; i < n; i++) {
    const a = here.points[i]!;
    const b = there.points[i]!;
    // People count points from 1.
    if (a.tempC !== b.tempC) out.push(`${name} point ${i + 1} temperature: ${num(a.tempC)} °C here, ${num(b.tempC)} °C in ${ref}`);
    if (a.dutyPct !== b.dutyPct) out.push(`${name} point ${i + 1}: ${num(a.dutyPct)} % here, ${num(b.dutyPct)} % in ${ref}`);
  }
  if (here.hysteresisC !== there.hysteresisC) out.push(`${name} hysteresis: ${num(here.hysteresisC)} °C here, ${num(there.hysteresisC)} °C in ${ref}`);
  if (here.rampUpPctPerSec !== there.rampUpPctPerSec) out.push(`${name} ramp-up limit: ${num(here.rampUpPctPerSec)} %/s here, ${num(there.rampUpPctPerSec)} %/s in ${ref}`);
  if (here.rampDownPctPerSec !== there.rampDownPctPerSec) out.push(`${name} ramp-down limit: ${num(here.rampDownPctPerSec)} %/s here, ${num(there.rampDownPctPerSec)} %/s in ${ref}`);
}

/**
 * The fields in which a decoded slot differs from a registry version, in the
 * trade's units, compared with the version as the board would store it
 * (quantised), so rounding alone is never reported as a change.
 */
export function slotDifferences(slot: DecodedSlot, known: RegistryVersion): string[] {
  const ref = `v${known.version}`;
  const q = quantise(known.document);
  const here = slot.settings;
  const out: string[] = [];
  if (slot.version !== known.version) out.push(`version: ${slot.version} here, ${known.version} in the registry`);
  if (slot.contentHashPrefix !== known.contentHash.slice(0, 16).toLowerCase()) out.push(`content label: ${slot.contentHashPrefix} here, ${known.contentHash.slice(0, 16).toLowerCase()} in ${ref}`);
  if (here.criticalTempC !== q.criticalTempC) out.push(`critical temperature: ${num(here.criticalTempC)} °C here, ${num(q.criticalTempC)} °C in ${ref}`);
  if (here.sensorLossDutyPct !== q.sensorLossDutyPct) out.push(`sensor-loss duty: ${num(here.sensorLossDutyPct)} % here, ${num(q.sensorLossDutyPct)} % in ${ref}`);
  const stop = (t: number | undefined): string => (t === undefined ? "fans never stop" : `fans stop below ${num(t)} °C`);
  if (here.fans.stopBelowTempC !== q.fans.stopBelowTempC) out.push(`fan stop: ${stop(here.fans.stopBelowTempC)} here, ${stop(q.fans.stopBelowTempC)} in ${ref}`);
  curveDifferences("pump", here.pump, q.pump, ref, out);
  curveDifferences("fan", here.fans, q.fans, ref, out);
  return out;
}

/**
 * The authoring rules (schema, order, safety, and the cooler's pump and fan
 * limits when its hardware is known) applied to what a slot holds. Errors
 * are faults: a board running this slot is not running a curve the registry
 * would have let anyone publish.
 */
export function slotFindings(slot: DecodedSlot, hardware?: HardwareContext): SlotFinding[] {
  const doc = { formatVersion: 1, name: `Slot ${slot.index + 1}`, ...slot.settings };
  return validateProfile(doc, hardware).issues.map((i) => ({ code: i.code, severity: i.severity, message: `${i.path ? `${i.path}: ` : ""}${i.message}` }));
}

/**
 * Identifies each slot of a decoded bank by content: "exact" only when its
 * bytes equal the registry's encoding of the version its content label
 * names; otherwise "altered" with the differing fields, "unknown", or
 * "undecodable" with the reason. Every decoded slot also gets the authoring
 * rules' findings.
 */
export function identifySlots(image: Uint8Array, decoded: DecodeBankResult, known: readonly RegistryVersion[]): SlotReport[] {
  const byPrefix = new Map<string, RegistryVersion[]>();
  for (const k of known) {
    if (typeof k?.contentHash !== "string" || typeof k.version !== "string" || typeof k.document !== "object" || k.document === null) continue;
    const prefix = k.contentHash.slice(0, 16).toLowerCase();
    byPrefix.set(prefix, [...(byPrefix.get(prefix) ?? []), k]);
  }
  const rows: SlotReport[] = decoded.slots.map((slot) => {
    const length = image[slot.offset] ?? 0;
    const bytes = image.subarray(slot.offset, slot.offset + length);
    const candidates = byPrefix.get(slot.contentHashPrefix) ?? [];
    // The version the slot names first, then any version with that content label.
    const ordered = [...candidates.filter((k) => k.version === slot.version), ...candidates.filter((k) => k.version !== slot.version)];
    const base = { slotIndex: slot.index, offset: slot.offset, version: slot.version, contentHashPrefix: slot.contentHashPrefix };
    const exact = ordered.find((k) => {
      const expected = registrySlotBytes(k);
      return expected !== null && sameBytes(expected, bytes);
    });
    const compared = exact ?? ordered[0];
    const findings = slotFindings(slot, compared?.hardware);
    if (!compared) return { ...base, match: "unknown", differences: [], findings };
    const named = { profileVersionId: compared.profileVersionId, knownVersion: compared.version, profileName: compared.profileName, coolerName: compared.coolerName };
    if (exact) return { ...base, ...named, match: "exact", differences: [], findings };
    const differences = slotDifferences(slot, compared);
    if (differences.length === 0) differences.push(`the slot's bytes differ from the registry's encoding of v${compared.version}`);
    return { ...base, ...named, match: "altered", differences, findings };
  });
  for (const u of decoded.undecodable) rows.push({ slotIndex: u.index, offset: u.offset, match: "undecodable", reason: u.reason, differences: [], findings: [] });
  return rows.sort((a, b) => a.slotIndex - b.slotIndex);
}

/** The build whose kept bank image has this SHA-256, if any. */
export function matchBuild(sha: string | undefined, builds: readonly RegistryBuild[]): RegistryBuild | undefined {
  return sha === undefined ? undefined : builds.find((b) => b.bankSha256.toLowerCase() === sha);
}
