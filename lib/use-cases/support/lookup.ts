import "server-only";
import type { Database } from "@/db/client";
import { findLookupBySerial, listRecentLookups, recordLookup, type LookupRow } from "@/db/lookup";
import { AppError } from "@/lib/api/errors";
import type { LookupResult, LookupSlot } from "@/lib/api/operations/support";
import { formatSerial, parseSerial, type Serial } from "@/lib/serials/serial";
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

/**
 * A serial as a person or a factory script typed it: parsed (400 when it is not PREFIX-NUMBER),
 * looked up on `read` (lots and published versions never change and a stage change may show a
 * moment late, so a replica may answer; docs/scale.md), and, for a person in the app, kept in
 * their recent lookups on `write`. 404 when no production lot covers it.
 */
export async function lookupSerialText(dbs: { read: Database; write: Database }, actor: { userId: string; via: "session" | "token" }, text: string): Promise<LookupResult> {
  const parsed = parseSerial(text);
  if (!parsed.ok) throw new AppError("bad_request", parsed.message);
  const result = await lookupSerial(dbs.read, parsed.serial);
  const serial = formatSerial(parsed.serial.prefix, parsed.serial.number);
  // The lookup page's history is a person's; factory and script calls with a token stay off it.
  if (actor.via === "session") await recordLookup(dbs.write, { userId: actor.userId, serial, found: Boolean(result) });
  if (!result) throw new AppError("not_found", `Serial ${serial} was not found: no production lot covers it. Check the number on the board's label.`);
  return result;
}

/** A person's last ten lookups, newest first. */
export async function recentLookups(db: Database, { userId }: { userId: string }) {
  const rows = await listRecentLookups(db, { userId, limit: 10 });
  return { items: rows.map((r) => ({ serial: r.serial, found: r.found, createdAt: r.createdAt.toISOString() })) };
}
