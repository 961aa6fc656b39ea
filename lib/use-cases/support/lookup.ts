import "server-only";
import type { Database } from "@/db/client";
import { findLookupSlots, findLotBySerial, type LookupSlotRow } from "@/db/lookup";
import type { LookupResult, LookupSlot } from "@/lib/api/operations/support";
import { formatSerial, type Serial } from "@/lib/serials/serial";
import { compareVersions, satisfiesRange } from "@/lib/versioning/semver-helpers";
import { diffBuildProfiles, type SlotProfile } from "@/lib/support/curve-diff";
import { pumpPulsesPerRev } from "@/lib/support/pump-pulses";
import type { CoolingProfile } from "@/lib/engine";

function toSlot(r: LookupSlotRow): LookupSlot {
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
 * What shipped on the board with this serial, in two prepared queries: the lot (btree
 * walk) with its revision and build, then the slots of that build and of the board
 * model's production builds. Newer builds are production builds with a greater semver
 * whose revision range includes the board's revision.
 */
export async function lookupSerial(db: Database, serial: Serial): Promise<LookupResult | undefined> {
  const found = await findLotBySerial(db, { prefix: serial.prefix, serialNumber: serial.number });
  if (!found) return undefined;
  const { lot, revision, build } = found;
  const rows = await findLookupSlots(db, { buildId: build.id, boardModelId: lot.boardModelId });
  const slots = rows.filter((r) => r.buildId === build.id).map(toSlot);
  const others = new Map<string, { version: string; range: string; slots: LookupSlot[] }>();
  for (const r of rows) {
    if (r.buildId === build.id || compareVersions(r.buildVersion, build.version) <= 0 || !satisfiesRange(revision.revision, r.revisionRange)) continue;
    const entry = others.get(r.buildId) ?? { version: r.buildVersion, range: r.revisionRange, slots: [] };
    entry.slots.push(toSlot(r));
    others.set(r.buildId, entry);
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
