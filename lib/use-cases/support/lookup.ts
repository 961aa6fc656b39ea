import "server-only";
import type { Database } from "@/db/client";
import { findLookupBySerial, type LookupRow } from "@/db/lookup";
import type { LookupResult, LookupSlot } from "@/lib/api/operations/support";
import { formatSerial, type Serial } from "@/lib/serials/serial";
import { compareVersions, satisfiesRange } from "@/lib/versioning/semver-helpers";
import { diffBuildProfiles, type SlotProfile } from "@/lib/support/curve-diff";
import { pumpPulsesPerRev } from "@/lib/support/pump-pulses";
import type { CoolingProfile } from "@/lib/engine";

/** A row with its slot present (builds without slots give one row with the slot fields null). */
function toSlot(r: LookupRow): LookupSlot | undefined {
  if (r.slotIndex === null || !r.profileVersionId || !r.profileId || !r.profileName || !r.version || !r.cooler || !r.fan || !r.pump) return undefined;
  return {
    slotIndex: r.slotIndex,
    profileVersionId: r.profileVersionId,
    profileId: r.profileId,
    profileName: r.profileName,
    version: r.version,
    document: r.document as CoolingProfile,
    cooler: r.cooler,
    fan: r.fan,
    pump: r.pump,
  };
}

const asSlotProfile = (s: LookupSlot): SlotProfile => ({ profileId: s.profileId, profileName: s.profileName, version: s.version, settings: s.document });

/**
 * What shipped on the board with this serial, from one prepared query: the lot (btree walk)
 * with its revision, and the slots of the shipped build and of the board model's production
 * builds. Newer builds are production builds with a greater semver whose revision range
 * includes the board's revision.
 */
export async function lookupSerial(db: Database, serial: Serial): Promise<LookupResult | undefined> {
  const rows = await findLookupBySerial(db, { prefix: serial.prefix, serialNumber: serial.number });
  const first = rows?.[0];
  if (!rows || !first) return undefined;
  const { lot, revision } = first;
  const shippedRow = rows.find((r) => r.build.id === lot.buildId);
  if (!shippedRow) return undefined;
  const { build } = shippedRow;
  const slots: LookupSlot[] = [];
  const others = new Map<string, { version: string; range: string; slots: LookupSlot[] }>();
  for (const r of rows) {
    const slot = toSlot(r);
    if (r.build.id === build.id) {
      if (slot) slots.push(slot);
      continue;
    }
    // As before the single query: a newer build counts through its slots.
    if (!slot || compareVersions(r.build.version, build.version) <= 0 || !satisfiesRange(revision.revision, r.build.revisionRange)) continue;
    const entry = others.get(r.build.id) ?? { version: r.build.version, range: r.build.revisionRange, slots: [] };
    entry.slots.push(slot);
    others.set(r.build.id, entry);
  }
  const shipped = slots.map(asSlotProfile);
  const newerBuilds = [...others.entries()]
    .sort((a, b) => compareVersions(b[1].version, a[1].version))
    .map(([id, b]) => ({ id, version: b.version, changes: diffBuildProfiles(shipped, b.slots.map(asSlotProfile)) }));
  const pumpRow = slots[0]?.pump;
  return {
    serial: formatSerial(serial.prefix, serial.number),
    lot: {
      id: lot.id,
      lotCode: lot.lotCode,
      serialFrom: formatSerial(serial.prefix, lot.serialFrom),
      serialTo: formatSerial(serial.prefix, lot.serialTo),
      producedOn: lot.producedOn,
      line: lot.line,
    },
    boardModel: { id: lot.boardModelId, serialPrefix: serial.prefix },
    boardRevision: revision,
    build,
    slots,
    pump: { name: pumpRow?.name ?? null, pulsesPerRev: pumpPulsesPerRev(pumpRow?.tachPulsesPerRev), source: pumpRow ? "registry" : "default" },
    newerBuilds,
  };
}
