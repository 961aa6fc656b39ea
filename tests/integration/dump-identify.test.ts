import zlib from "node:zlib";
import { createHash } from "node:crypto";
import { afterAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { closeDb, getDb } from "./support/db";
import { callRoute, tokenFor } from "./support/http";
import { POST as identifyRoute } from "@/app/api/v1/dumps/identify/route";
import { identifyDumpBytes } from "@/lib/use-cases/support/identify-dump";
import { writeIntelHex, type DumpReport } from "@/lib/engine";
import { boardModels, builds } from "@/db/schema";

afterAll(closeDb);

async function demoBuild(version: string) {
  const db = getDb();
  const [board] = await db.select().from(boardModels).where(eq(boardModels.serialPrefix, "TC1"));
  const [build] = await db.select().from(builds).where(and(eq(builds.boardModelId, board!.id), eq(builds.version, version)));
  return build!;
}

/** Rewrites the CRC-32 trailer with zlib's CRC-32, as someone hiding a change would. */
function recomputeCrc(b: Uint8Array): Uint8Array {
  new DataView(b.buffer, b.byteOffset).setUint32(b.length - 4, zlib.crc32(b.subarray(0, b.length - 4)), true);
  return b;
}

// docs/bank-format.md: slot 0 starts after the 8-byte header; its pump points start at slot offset 19, 2 bytes each.
const PUMP_POINT_2_DUTY = 8 + 19 + 2 * 1 + 1;

describe("memory dump identification by content", () => {
  it("identifies every slot of a demo build's image as exact, and names the build with its stage, as .bin and Intel HEX", async () => {
    const build = await demoBuild("3.0.0");
    const bytes = build.bankImage!;
    expect(createHash("sha256").update(bytes).digest("hex")).toBe(build.bankSha256);
    const bin = await identifyDumpBytes(getDb(), { bytes, fileName: "a.bin" });
    expect(bin).toMatchObject({ status: "ok", format: "bin", crc: { ok: true }, build: { buildId: build.id, version: "3.0.0", stage: build.stage } });
    expect(bin.slots.map((s) => [s.match, s.profileName, s.version])).toEqual([
      ["exact", "Quiet", "1.0.0"],
      ["exact", "Performance", "1.0.0"],
    ]);
    expect(bin.faults).toEqual([]);
    const hex = await identifyDumpBytes(getDb(), { bytes: new TextEncoder().encode(writeIntelHex(bytes, 0x0800f000)), fileName: "a.hex" });
    expect(hex).toMatchObject({ status: "ok", format: "hex", build: { version: "3.0.0" } });
    expect(hex.slots.map((s) => s.match)).toEqual(["exact", "exact"]);
  });

  it("changed slot bytes with a recomputed CRC are never exact, through the API too: altered, with the field", async () => {
    const build = await demoBuild("3.0.0");
    const bytes = Uint8Array.from(build.bankImage!);
    const was = bytes[PUMP_POINT_2_DUTY]!;
    bytes[PUMP_POINT_2_DUTY] = was + 4; // +2 % (0.5 % per code)
    recomputeCrc(bytes);
    const direct = await identifyDumpBytes(getDb(), { bytes, fileName: null });
    expect(direct.status).toBe("ok");
    expect(direct.build).toBeUndefined();
    expect(direct.slots[0]!.match).toBe("altered");
    expect(direct.slots[0]!.differences).toEqual([`pump point 2: ${(was + 4) / 2} % here, ${was / 2} % in v1.0.0`]);

    const token = await tokenFor("support@tarnwell.example");
    const res = await callRoute(identifyRoute, { url: "/api/v1/dumps/identify", method: "POST", token, body: Buffer.from(bytes), headers: { "content-type": "application/octet-stream", "x-file-name": "changed.bin" } });
    expect(res.status).toBe(200);
    const viaApi = (await res.json()) as DumpReport;
    expect(viaApi.slots.map((s) => s.match)).toEqual(direct.slots.map((s) => s.match));
    expect(viaApi.slots[0]!.differences).toEqual(direct.slots[0]!.differences);
    expect(viaApi.faults).toEqual(direct.faults);
  });

  it("reports a flipped byte as corrupt, an undecodable slot with its reason, and a foreign file as unreadable", async () => {
    const bytes = Uint8Array.from((await demoBuild("3.0.0")).bankImage!);
    // Byte 20 is slot 0's critical temperature (docs/bank-format.md: slot at 8, field at slot offset 12).
    bytes[20] = bytes[20]! ^ 0x01;
    const bad = await identifyDumpBytes(getDb(), { bytes, fileName: null });
    expect(bad.status).toBe("corrupt");
    expect(bad.crc?.ok).toBe(false);
    expect(bad.slots[0]!.match).toBe("altered");
    expect(bad.slots[0]!.differences[0]).toMatch(/^critical temperature: /);
    // Slot 1's bytes are untouched, so it still equals the registry's encoding.
    expect(bad.slots[1]!.match).toBe("exact");
    const outOfRange = Uint8Array.from((await demoBuild("3.0.0")).bankImage!);
    outOfRange[PUMP_POINT_2_DUTY] = 250;
    const u = await identifyDumpBytes(getDb(), { bytes: recomputeCrc(outOfRange), fileName: null });
    expect(u.slots[0]).toMatchObject({ match: "undecodable", slotIndex: 0 });
    expect(u.slots[0]!.reason).toMatch(/duty byte 250/);
    expect((await identifyDumpBytes(getDb(), { bytes: new TextEncoder().encode("hello world, not a bank"), fileName: null })).status).toBe("unreadable");
  });
});
