import { afterAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, demoActor, getDb } from "./support/db";
import { callRoute, tokenFor } from "./support/http";
import { coolerModels } from "@/db/schema";
import { getProfileDetail } from "@/db/profiles";
import { createProfile } from "@/lib/use-cases/profiles/create";
import { saveDraft } from "@/lib/use-cases/profiles/save-draft";
import { GET as getProfile } from "@/app/api/v1/profiles/[id]/route";
import { PUT as putDraft } from "@/app/api/v1/profiles/[id]/draft/route";

afterAll(closeDb);

async function newProfile() {
  const db = getDb();
  const engineer = await demoActor("engineer@tarnwell.example");
  const [cooler] = await db.select().from(coolerModels).where(eq(coolerModels.name, "Tarn 360"));
  return createProfile(db, engineer, { coolerModelId: cooler!.id, name: `As typed ${Date.now()}-${Math.random().toString(36).slice(2, 6)}`, description: "" });
}

/** The draft revision the next save is based on (saves are refused when based on a stale one). */
async function currentRevision(id: string): Promise<number> {
  return (await getProfileDetail(getDb(), { id }))!.profile.draftRevision;
}

async function saveAndReadBack(id: string, token: string, text: string): Promise<string> {
  const baseRevision = await currentRevision(id);
  const put = await callRoute(putDraft, { url: `/api/v1/profiles/${id}/draft`, method: "PUT", token, params: { id }, body: JSON.stringify({ text, baseRevision }), headers: { "content-type": "application/json" } });
  expect(put.status, await put.clone().text()).toBe(200);
  const got = await callRoute(getProfile, { url: `/api/v1/profiles/${id}`, token, params: { id } });
  expect(got.status).toBe(200);
  return ((await got.json()) as { profile: { draftText: string } }).profile.draftText;
}

describe("the draft is the author's text", () => {
  it("reads back byte for byte: key order, spacing, tabs, CRLF, escapes and non-ASCII as typed", async () => {
    const profile = await newProfile();
    const token = await tokenFor("engineer@tarnwell.example");
    // Keys deliberately not alphabetical ("name" before "$schema", "pump" before "fans"),
    // mixed indentation, a CRLF line, trailing blanks, an escape and a literal degree sign.
    const text = [
      "{",
      '  "name":    "Quiet \\u00b0 night",   ',
      '\t"$schema": "https://loopkeeper.example/schemas/profile.schema.json",\r',
      '  "pump" : { "points": [ {"tempC": 20, "dutyPct": 40},{"tempC":60,"dutyPct":100} ] },',
      '      "fans": {"points":[{"tempC":20,"dutyPct":25}, {"tempC": 60, "dutyPct": 100}]},',
      '  "criticalTempC": 60.0, "note": "30 °C – fine"',
      "}",
      "",
    ].join("\n");
    const back = await saveAndReadBack(profile.id, token, text);
    expect(back).toBe(text);
    expect(Buffer.from(back, "utf8").equals(Buffer.from(text, "utf8"))).toBe(true);
    // Through the query function too, as the editor page's server render reads it.
    expect((await getProfileDetail(getDb(), { id: profile.id }))!.profile.draftText).toBe(text);
  });

  it("keeps text that is not JSON yet, unchanged", async () => {
    const profile = await newProfile();
    const token = await tokenFor("engineer@tarnwell.example");
    const text = '{\n  "name": "half typed",\n  "pump": { "points": [\n';
    expect(await saveAndReadBack(profile.id, token, text)).toBe(text);
  });
});

describe("a draft with a NUL character", () => {
  it("is refused with a field message and leaves the stored draft as it was", async () => {
    const profile = await newProfile();
    const token = await tokenFor("engineer@tarnwell.example");
    const before = await saveAndReadBack(profile.id, token, '{ "name": "kept" }');
    const put = await callRoute(putDraft, { url: `/api/v1/profiles/${profile.id}/draft`, method: "PUT", token, params: { id: profile.id }, body: JSON.stringify({ text: '{ "name": "a\u0000b" }', baseRevision: await currentRevision(profile.id) }), headers: { "content-type": "application/json" } });
    expect(put.status).toBe(422);
    expect(await put.text()).toMatch(/NUL character/);
    expect((await getProfileDetail(getDb(), { id: profile.id }))!.profile.draftText).toBe(before);
  });
});

describe("the last plottable draft", () => {
  it("is offered only while the draft text does not pass the schema", async () => {
    const profile = await newProfile();
    const db = getDb();
    const engineer = await demoActor("engineer@tarnwell.example");
    const good = (await getProfileDetail(db, { id: profile.id }))!.profile;
    expect(good.lastPlottableDraftText).toBeNull();
    await saveDraft(db, engineer, { id: profile.id, text: `${good.draftText!.slice(0, 40)}` });
    const broken = (await getProfileDetail(db, { id: profile.id }))!.profile;
    expect(broken.draftText).toBe(good.draftText!.slice(0, 40));
    expect(JSON.parse(broken.lastPlottableDraftText!)).toEqual(JSON.parse(good.draftText!));
    await saveDraft(db, engineer, { id: profile.id, text: good.draftText! });
    expect((await getProfileDetail(db, { id: profile.id }))!.profile.lastPlottableDraftText).toBeNull();
  });
});
