import { afterAll, describe, expect, it } from "vitest";
import { randomUUID } from "node:crypto";
import { closeDb } from "./support/db";
import { callRoute, tokenFor } from "./support/http";
import { freshDraftBuild } from "./support/builds";
import { GET as downloadBank } from "@/app/api/v1/builds/[id]/bank/route";
import { GET as downloadVectors } from "@/app/api/v1/builds/[id]/vectors/route";
import { decodeBank } from "@/lib/engine";
import type { FirmwareVectors } from "@/lib/firmware";

process.env.LOOPKEEPER_LOG = "silent";
afterAll(closeDb);

describe("GET /api/v1/builds/{id}/vectors", () => {
  it("gives the firmware vectors of exactly the stored bank image, to any signed-in role", async () => {
    const b = await freshDraftBuild();
    const token = await tokenFor("viewer@tarnwell.example");
    const bin = new Uint8Array(await (await callRoute(downloadBank, { url: `/api/v1/builds/${b.id}/bank?format=bin`, token, params: { id: b.id } })).arrayBuffer());
    const res = await callRoute(downloadVectors, { url: `/api/v1/builds/${b.id}/vectors`, token, params: { id: b.id } });
    expect(res.status).toBe(200);
    expect(res.headers.get("content-disposition")).toMatch(/attachment; filename="vectors-.+\.json"/);
    const v = (await res.json()) as FirmwareVectors;
    expect(v.format).toBe("loopkeeper-firmware-vectors");
    expect(v.bank.hex).toBe(Buffer.from(bin).toString("hex"));
    const decoded = decodeBank(bin);
    expect(v.slots.map((s) => s.contentHashPrefix)).toEqual(decoded.slots.map((s) => s.contentHashPrefix));
    expect(v.slots.map((s) => s.codes)).toEqual(decoded.slots.map((s) => s.codes));
    for (const s of v.slots) {
      expect(s.sweep.pumpDutyCode).toHaveLength(201);
      expect(s.traces.some((t) => t.tempDeciC.includes(null))).toBe(true);
    }
  });

  it("answers 404 for an unknown build", async () => {
    const token = await tokenFor("support@tarnwell.example");
    const id = randomUUID();
    const res = await callRoute(downloadVectors, { url: `/api/v1/builds/${id}/vectors`, token, params: { id } });
    expect(res.status).toBe(404);
  });
});
