import "server-only";
import type { Database } from "@/db/client";
import { findLotBySerial, listRecentLookups, recordLookup } from "@/db/lookup";
import { AppError } from "@/lib/api/errors";
import type { LookupResult, LookupSlot } from "@/lib/api/operations/support";
import { formatSerial, parseSerial, type Serial } from "@/lib/serials/serial";
import { compareVersions, satisfiesRange } from "@/lib/versioning/semver-helpers";
import { diffBuildProfiles, type SlotProfile } from "@/lib/support/curve-diff";
import { pumpPulsesPerRev } from "@/lib/support/pump-pulses";
import { slotsOfBuilds } from "./build-slots";

const asSlotProfile = (s: LookupSlot): SlotProfile => ({ profileId: s.profileId, profileName: s.profileName, version: s.version, settings: s.document });

/**
 * What shipped on the board with this serial: the lot (btree walk) with its revision and the
 * stage, as it is now, of the shipped build and of the board model's production builds, in
 * one prepared query; the slots of the builds shown from `slotsOfBuilds` (kept in process by
 * build id, fixed once a build leaves draft). Newer builds are production builds with a
 * greater semver whose revision range includes the board's revision, and that have slots.
 */
export async function lookupSerial(db: Database, serial: Serial): Promise<LookupResult | undefined> {
  const found = await findLotBySerial(db, { prefix: serial.prefix, serialNumber: serial.number });
  if (!found) return undefined;
  const { lot, revision } = found;
  const build = found.builds.find((b) => b.id === lot.buildId);
  if (!build) return undefined;
  const newer = found.builds
    .filter((b) => b.id !== build.id && compareVersions(b.version, build.version) > 0 && satisfiesRange(revision.revision, b.revisionRange))
    .sort((a, b) => compareVersions(b.version, a.version));
  const slotsBy = await slotsOfBuilds(db, [build, ...newer]);
  const slots = slotsBy.get(build.id) ?? [];
  const shipped = slots.map(asSlotProfile);
  const newerBuilds = newer.flatMap((b) => {
    // As before: a newer build counts through its slots.
    const theirs = slotsBy.get(b.id) ?? [];
    return theirs.length ? [{ id: b.id, version: b.version, changes: diffBuildProfiles(shipped, theirs.map(asSlotProfile)) }] : [];
  });
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
