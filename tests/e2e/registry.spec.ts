import { expect, test } from "@playwright/test";
import { ACCOUNTS, signInPage } from "./support/accounts";
import { ProfileCompare, ProfileEditor, ProfilesList } from "./pages/profiles";
import { BoardsPage, ComponentsList, CoolerModelsList } from "./pages/registry";

interface Doc {
  pump: { points: { tempC: number; dutyPct: number }[] };
  fans: { points: { tempC: number; dutyPct: number }[] };
}

test.describe("profile editor, as an engineer", () => {
  test("create, see a problem, fix it, publish 1.0.0 and 1.1.0, compare — all requests stay on 127.0.0.1", async ({ page }) => {
    const offHost: string[] = [];
    page.on("request", (req) => {
      const url = new URL(req.url());
      if ((url.protocol === "http:" || url.protocol === "https:") && url.hostname !== "127.0.0.1") offHost.push(req.url());
    });
    await signInPage(page, ACCOUNTS.engineer);
    const list = await new ProfilesList(page).goto();
    const id = await list.start({ cooler: "Tarn 360", name: `Field test ${Date.now()}` });
    const editor = new ProfileEditor(page);
    await expect(editor.coolerName).toHaveText("Tarn 360");
    await expect(editor.editor).toBeVisible();
    await expect(editor.chart).toBeVisible();

    // The starter draft, read back through the API, then an invalid pump point.
    const detail = (await (await page.request.get(`/api/v1/profiles/${id}`)).json()) as { profile: { draftText: string } };
    const doc = JSON.parse(detail.profile.draftText) as Doc;
    doc.pump.points[0]!.dutyPct = 10;
    await editor.setText(`${JSON.stringify(doc, null, 2)}\n`);
    const problem = editor.problem(/below the pump's minimum duty/);
    await expect(problem).toBeVisible();
    await expect(editor.editor.locator(".squiggly-error").first()).toBeVisible();
    const chart = editor.chart;
    const pumpRpmBefore = Number(await chart.getAttribute("data-first-pump-rpm"));

    // Jump to the problem and fix it by typing: the cursor lands on the value 10.
    await problem.click();
    await page.keyboard.press("Delete");
    await page.keyboard.press("Delete");
    await page.keyboard.type("55");
    await expect(problem).toBeHidden();
    await expect.poll(async () => Number(await chart.getAttribute("data-first-pump-rpm"))).toBeGreaterThan(pumpRpmBefore);
    await expect(editor.saveState).toHaveText("Draft saved");

    // Publish 1.0.0.
    await editor.expectSuggested("1.0.0");
    await editor.publish({ changelog: "First release from the browser test." });
    await expect(page.getByText(/Published 1\.0\.0/)).toBeVisible();

    // Change a fan point: a curve change suggests a minor bump.
    const current = (await (await page.request.get(`/api/v1/profiles/${id}`)).json()) as { profile: { draftText: string } };
    const next = JSON.parse(current.profile.draftText) as Doc;
    next.fans.points[1]!.dutyPct = Math.min(100, next.fans.points[1]!.dutyPct + 10);
    const fanBefore = await chart.getAttribute("data-fan-rpm-40c");
    await editor.setText(`${JSON.stringify(next, null, 2)}\n`);
    await expect.poll(() => chart.getAttribute("data-fan-rpm-40c")).not.toBe(fanBefore);
    await editor.expectSuggested("1.1.0");
    await editor.publish({ changelog: "Fans faster at 40 °C." });
    await expect(page.getByText(/Published 1\.1\.0/)).toBeVisible();

    // A second publish of the same number is a clear conflict.
    await expect(editor.suggestion).toContainText("1.1.1");
    await editor.publish({ version: "1.1.0", changelog: "again" });
    await expect(editor.alert(/not greater than 1\.1\.0/)).toBeVisible();

    // Compare the two versions.
    await page.getByRole("link", { name: "Compare with 1.0.0" }).click();
    await page.waitForURL(/\/compare\?a=.*&b=/);
    const compare = new ProfileCompare(page);
    await expect(compare.chart).toBeVisible();
    await expect(compare.diff).toBeVisible();

    expect(offHost, "requests that left 127.0.0.1").toEqual([]);
  });

  test("the memory gauge judges the range typed under Publish, live, as publishing does", async ({ page }) => {
    await signInPage(page, ACCOUNTS.engineer);
    const id = await new ProfilesList(page).goto().then((list) => list.start({ cooler: "Tarn 360", name: `Seven points ${Date.now()}` }));
    const editor = new ProfileEditor(page);
    const detail = (await (await page.request.get(`/api/v1/profiles/${id}`)).json()) as { profile: { draftText: string } };
    const doc = JSON.parse(detail.profile.draftText) as Doc & { criticalTempC: number };
    // Seven fan points: revision 1.0.0 of the demo board stores at most six per curve.
    const top = doc.criticalTempC - 2;
    doc.fans.points = [top - 36, top - 30, top - 24, top - 18, top - 12, top - 6, top].map((tempC, i) => ({ tempC, dutyPct: [30, 35, 45, 55, 70, 85, 100][i]! }));
    await editor.setText(`${JSON.stringify(doc, null, 2)}\n`);

    await editor.rangeField.fill(">=1.0.0");
    await expect(editor.rangeVerdict).toContainText("revision 1.0.0 (a curve has 7 points; it stores at most 6)");
    await expect(editor.memoryRow("1.0.0")).toHaveAttribute("data-fits", "false");
    await expect(editor.memoryRow("1.0.0")).toContainText("in the range but cannot hold it");
    // The server refuses with the same words.
    await editor.publish({ changelog: "Seven-point fan curve." });
    await expect(page.getByRole("alert").filter({ hasText: "revision 1.0.0 (a curve has 7 points; it stores at most 6)" })).toBeVisible();

    await editor.rangeField.fill(">=1.1.0");
    await expect(editor.rangeVerdict).toHaveText('Every revision in ">=1.1.0" holds this profile.');
    await expect(editor.memoryRow("1.0.0")).toHaveAttribute("data-in-range", "false");
    await editor.publish({ changelog: "Seven-point fan curve." });
    await expect(page.getByText(/Published 1\.0\.0/)).toBeVisible();
  });
});

test.describe("registry, as a viewer", () => {
  test("pages are read-only and the write routes answer 403", async ({ page }) => {
    await signInPage(page, ACCOUNTS.viewer);
    const list = (await (await page.request.get("/api/v1/profiles?q=Hush")).json()) as { items: { id: string; name: string }[] };
    const hush = list.items.find((p) => p.name === "Hush")!;
    const editor = await new ProfileEditor(page).goto(hush.id);
    await expect(editor.editor).toBeVisible();
    await expect(page.getByText("Read only: your role may not edit profiles.")).toBeVisible();
    // A reader is not told to edit or that drafts save themselves.
    await expect(editor.page.getByText(/Drafts save themselves/)).toHaveCount(0);
    await expect(editor.page.getByText(/Edit the JSON/)).toHaveCount(0);
    await editor.expectNoButton("Publish version");
    await expect(page.getByText("Import .json")).toHaveCount(0);

    // Filtered: earlier runs leave other profiles that can push it to a later page.
    const profiles = await new ProfilesList(page).goto({ q: "Hush" });
    await expect(profiles.link("Hush")).toBeVisible();
    await profiles.expectNoButton("Create and open the editor");

    const text = `${JSON.stringify({ formatVersion: 1 })}\n`;
    expect((await page.request.put(`/api/v1/profiles/${hush.id}/draft`, { data: { text, baseRevision: 0 } })).status()).toBe(403);
    expect((await page.request.post(`/api/v1/profiles/${hush.id}/versions`, { data: { version: "9.0.0", changelog: "x", boardRange: ">=1.0.0", text } })).status()).toBe(403);
    expect((await page.request.post("/api/v1/profiles", { data: { coolerModelId: "00000000-0000-4000-8000-000000000000", name: "x", description: "" } })).status()).toBe(403);
  });

  test("the board revision page shows why a version does not fit", async ({ page }) => {
    await signInPage(page, ACCOUNTS.viewer);
    const revision = await (await new BoardsPage(page).goto()).openRevision("0.9.0");
    await expect(page.getByText(/99 bytes but the revision has 96/).first()).toBeVisible();
    await revision.expectNoButton("Add revision");
    await revision.expectNoButton("Edit limits");
  });

  test("the editor evaluates a profile on another cooler of the same board, and says whose profile it is", async ({ page }) => {
    await signInPage(page, ACCOUNTS.viewer);
    const list = (await (await page.request.get("/api/v1/profiles?q=Hush")).json()) as { items: { id: string; name: string }[] };
    const hush = list.items.find((p) => p.name === "Hush")!;
    const editor = await new ProfileEditor(page).goto(hush.id);
    const own = (await editor.coolerName.textContent())!;
    const chart = editor.chart;
    await expect(chart).toBeVisible();
    const picker = editor.coolerPicker;
    // Its own cooler plus the other coolers of the TC-1 board (tests may have added more).
    await expect.poll(() => picker.locator("option").count()).toBeGreaterThanOrEqual(2);
    await expect(picker.locator("option:checked")).toContainText(`${own} (this profile's cooler)`);
    const fanBefore = await chart.getAttribute("data-fan-rpm-40c");

    const other = own === "Tarn 240" ? "Tarn 360" : "Tarn 240";
    const otherLabel = (await picker.locator("option", { hasText: `${other} ·` }).first().textContent())!;
    await picker.selectOption({ label: otherLabel });
    // The two coolers use different fans, so the plotted fan speed at 40 °C moves.
    await expect.poll(() => chart.getAttribute("data-fan-rpm-40c")).not.toBe(fanBefore);
    await expect(editor.otherCoolerNote).toContainText(`on ${other}`);
    await expect(editor.otherCoolerNote).toContainText(`still belongs to ${own}`);
    await expect(editor.coolerName).toHaveText(own);

    await editor.button(`Back to ${own}`).click();
    await expect(editor.otherCoolerNote).toHaveCount(0);
    await expect.poll(() => chart.getAttribute("data-fan-rpm-40c")).toBe(fanBefore);
  });
});

test.describe("registry edits, as an engineer", () => {
  test("edit a cooler model: field error from the shared schema, then a saved change", async ({ page }) => {
    await signInPage(page, ACCOUNTS.engineer);
    const all = (await (await page.request.get("/api/v1/cooler-models?q=Tarn 240")).json()) as { items: { fanComponentId: string; pumpComponentId: string; boardModelId: string }[] };
    const base = all.items[0]!;
    const name = `Edit test ${Date.now()}`;
    const created = await page.request.post("/api/v1/cooler-models", {
      data: { name, radiatorMm: 240, fanComponentId: base.fanComponentId, fanCount: 2, pumpComponentId: base.pumpComponentId, boardModelId: base.boardModelId, radiatorKPerWAtMinFan: 0.12, radiatorKPerWAtMaxFan: 0.06 },
    });
    expect(created.status()).toBe(201);

    const coolers = await new CoolerModelsList(page).goto({ q: name });
    const form = await coolers.edit(name);
    const fans = form.getByLabel("Number of fans");
    await expect(fans).toHaveValue("2");
    await fans.fill("0");
    await form.getByRole("button", { name: "Save changes" }).click();
    await expect(form.getByText("At least 1 fan.")).toBeVisible();
    await fans.fill("3");
    await form.getByRole("button", { name: "Save changes" }).click();
    await coolers.expectNoButton("Save changes");
    await expect(coolers.row(name)).toContainText("3 ×");
  });

  test("register a fan that stops at 0 % duty with a measured sound table; the list shows both", async ({ page }) => {
    await signInPage(page, ACCOUNTS.engineer);
    const list = await new ComponentsList(page).goto();
    const name = `Table fan ${Date.now()}`;
    const fan = { name, kind: "fan" as const, minDutyPct: 20, rpmAtMinDuty: 500, maxRpm: 1800, refSoundDbA: 30, refRpm: 1800, stopsAtZeroDuty: true };
    // Speeds out of order: the shared request schema names the problem beside the table.
    await list.fillComponent({ ...fan, soundTable: "at 1 m\n1200 24\n500 14\n1800 30" });
    await list.button("Add component").click();
    await expect(list.addForm.getByText("List the measurements by rising RPM, one per speed.")).toBeVisible();
    await list.fillComponent({ ...fan, soundTable: "at 1 m\n500 14\n1200 24\n1800 30" });
    await list.button("Add component").click();
    await expect(page.getByText("Component added.")).toBeVisible();
    await list.goto({ q: name });
    await expect(list.row(name)).toContainText("measured table, 3 points at 1 m");
    await expect(list.row(name)).toContainText("stops");
    const saved = (await (await page.request.get(`/api/v1/components?q=${encodeURIComponent(name)}`)).json()) as { items: { stopsAtZeroDuty: boolean; soundTable: unknown }[] };
    expect(saved.items[0]).toMatchObject({ stopsAtZeroDuty: true, soundTable: { distanceM: 1, points: [{ rpm: 500, soundDbA: 14 }, { rpm: 1200, soundDbA: 24 }, { rpm: 1800, soundDbA: 30 }] } });
  });

  test("the editor refuses a listener distance inside the cooler's near field and gives the level farther away", async ({ page }) => {
    await signInPage(page, ACCOUNTS.engineer);
    await new ProfilesList(page).goto().then((profiles) => profiles.start({ cooler: "Tarn 240", name: `Distance ${Date.now()}` }));
    const editor = new ProfileEditor(page);
    await expect(editor.operatingReadout).toContainText("dB(A) at 1 m");
    await editor.listenerDistance.fill("0.1");
    await expect(page.getByText("0.1 m is inside the cooler's near field (closer than about the radiator's largest dimension, 240 mm), where the estimate does not hold: use at least 0.24 m.")).toBeVisible();
    await expect(editor.operatingReadout).not.toContainText("at 0.1 m");
    await editor.listenerDistance.fill("2");
    await expect(editor.operatingReadout).toContainText(/dB\(A\) at 1 m, [\d.]+ dB\(A\) at 2 m/);
  });
});
