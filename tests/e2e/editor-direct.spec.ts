import { expect, test, type Page } from "@playwright/test";
import { expectAccessible } from "./support/a11y";
import { ACCOUNTS, signInPage } from "./support/accounts";

interface Point {
  tempC: number;
  dutyPct: number;
}
interface Doc {
  pump: { points: Point[]; hysteresisC: number };
  fans: { points: Point[]; hysteresisC: number; stopBelowTempC?: number };
}

/** A fresh profile of our own (the starter draft: 3 points per curve at 25, 40 and 55 °C), opened in the editor. */
async function openFreshProfile(page: Page): Promise<{ pumpMinDutyPct: number }> {
  await signInPage(page, ACCOUNTS.engineer);
  const models = (await (await page.request.get("/api/v1/cooler-models?q=Tarn 240")).json()) as { items: { id: string; name: string }[] };
  const model = models.items.find((m) => m.name === "Tarn 240")!;
  const created = await page.request.post("/api/v1/profiles", { data: { coolerModelId: model.id, name: `Direct edit ${Date.now()}-${Math.random().toString(36).slice(2, 7)}`, description: "" } });
  expect(created.status()).toBe(201);
  const { profile } = (await created.json()) as { profile: { id: string } };
  const detail = (await (await page.request.get(`/api/v1/profiles/${profile.id}`)).json()) as { pump: { minDutyPct: number } };
  await page.goto(`/profiles/${profile.id}`);
  await page.waitForFunction(() => Boolean(window.__loopkeeperEditor));
  await expect(page.getByRole("slider", { name: "fan point 2" })).toBeVisible();
  return { pumpMinDutyPct: detail.pump.minDutyPct };
}

const editorText = (page: Page) => page.evaluate(() => window.__loopkeeperEditor!.getText());

/** Offset of the n-th (1-based) `"dutyPct": ` value after the `"fans"` key: where fan point n's duty is written. */
function fanDutyOffset(text: string, n: number): number {
  let at = text.indexOf('"fans"');
  for (let i = 0; i < n; i++) at = text.indexOf('"dutyPct": ', at + 1);
  return at + '"dutyPct": '.length;
}

/** Drags a handle by (dx, dy) pixels in small steps, as a hand would. */
async function drag(page: Page, name: string, dx: number, dy: number) {
  const box = (await page.getByRole("slider", { name, exact: true }).boundingBox())!;
  const x0 = box.x + box.width / 2;
  const y0 = box.y + box.height / 2;
  await page.mouse.move(x0, y0);
  await page.mouse.down();
  for (let i = 1; i <= 10; i++) await page.mouse.move(x0 + (dx * i) / 10, y0 + (dy * i) / 10);
  await page.mouse.up();
}

test.describe("direct editing of curves on the plot, as an engineer", () => {
  // Monaco, the plot and axe on a shared 2-core machine: more than the default minute.
  test.describe.configure({ timeout: 180_000 });
  test("dragging a fan point changes exactly that number in the JSON, and one undo restores the text byte for byte", async ({ page }) => {
    await openFreshProfile(page);
    const before = await editorText(page);
    const duty0 = (JSON.parse(before) as Doc).fans.points[1]!.dutyPct;

    await drag(page, "fan point 2", 0, -40);
    await expect.poll(async () => (JSON.parse(await editorText(page)) as Doc).fans.points[1]!.dutyPct).toBeGreaterThan(duty0);
    const after = await editorText(page);
    const doc = JSON.parse(after) as Doc;
    const duty = doc.fans.points[1]!.dutyPct;
    // Exactly that number changed: the text is the old one with the new digits in its place.
    const at = fanDutyOffset(before, 2);
    expect(before.slice(at, at + String(duty0).length)).toBe(String(duty0));
    expect(after).toBe(before.slice(0, at) + String(duty) + before.slice(at + String(duty0).length));
    // Drags snap to the board's 0.5 % step; the handle announces the same number.
    expect(Number.isInteger(duty * 2)).toBe(true);
    await expect(page.getByRole("slider", { name: "fan point 2" })).toHaveAttribute("aria-valuetext", `fan point 2, 40 °C, ${duty} %`);
    // The temperature did not move with a vertical drag.
    expect(doc.fans.points[1]!.tempC).toBe(40);

    // Undo in the text editor itself: one step takes the whole drag back.
    await page.locator(".monaco-editor .view-lines").click();
    await page.keyboard.press("Control+z");
    await expect.poll(() => editorText(page)).toBe(before);
    await expect(page.getByRole("slider", { name: "fan point 2" })).toHaveAttribute("aria-valuenow", String(duty0));
  });

  test("every point takes a press at its very centre: no mark drawn over the plot covers a handle", async ({ page }) => {
    await openFreshProfile(page);
    await page.getByTestId("curve-chart").scrollIntoViewIfNeeded();
    // What the browser hits at each point handle's centre (fractional pixels, as a pointer reports them).
    const hits = await page.getByTestId("curve-chart").evaluate((figure) =>
      [...figure.querySelectorAll<SVGElement>('circle[role="slider"]')].map((handle) => {
        const r = handle.getBoundingClientRect();
        const hit = document.elementFromPoint(r.left + r.width / 2, r.top + r.height / 2);
        return { handle: handle.getAttribute("aria-label"), hit: hit === handle ? "itself" : (hit?.outerHTML.slice(0, 120) ?? "nothing") };
      }),
    );
    expect(hits.length).toBe(6);
    for (const h of hits) expect(h, h.handle ?? "").toEqual({ handle: h.handle, hit: "itself" });
  });

  test("a pump point dragged below the pump's minimum duty stops at the minimum and says why", async ({ page }) => {
    const { pumpMinDutyPct } = await openFreshProfile(page);
    const handle = page.getByRole("slider", { name: "pump point 1" });
    // Raise it by 10 % first (keyboard, Shift = 5 % a press), then drag far down.
    await handle.focus();
    await page.keyboard.press("Shift+ArrowUp");
    await page.keyboard.press("Shift+ArrowUp");
    const raised = (JSON.parse(await editorText(page)) as Doc).pump.points[0]!.dutyPct;
    expect(raised).toBeGreaterThan(pumpMinDutyPct);
    await drag(page, "pump point 1", 0, 200);
    await expect.poll(async () => (JSON.parse(await editorText(page)) as Doc).pump.points[0]!.dutyPct).toBe(pumpMinDutyPct);
    await expect(page.getByTestId("handle-reason")).toContainText(`pump's minimum duty ${pumpMinDutyPct} %`);
    await expect(page.getByTestId("edit-notice")).toContainText("below it the pump may stall");
  });

  test("keyboard only: arrow keys move a point in 0.5 steps (Shift: 5), and the points table edits the same numbers", async ({ page }) => {
    await openFreshProfile(page);
    const start = JSON.parse(await editorText(page)) as Doc;
    const p = start.fans.points[2]!; // 55 °C, 100 %
    // Tab from the plot's first handle to the third fan point, as a keyboard user would.
    await page.getByRole("slider", { name: "pump point 1" }).focus();
    for (let i = 0; i < 5; i++) await page.keyboard.press("Tab");
    await expect(page.getByRole("slider", { name: "fan point 3" })).toBeFocused();
    await page.keyboard.press("ArrowLeft");
    await page.keyboard.press("Shift+ArrowDown");
    await expect.poll(async () => (JSON.parse(await editorText(page)) as Doc).fans.points[2]).toEqual({ tempC: p.tempC - 0.5, dutyPct: p.dutyPct - 5 });
    await expect(page.getByRole("slider", { name: "fan point 3" })).toHaveAttribute("aria-valuetext", `fan point 3, ${p.tempC - 0.5} °C, ${p.dutyPct - 5} %`);

    // The table shows the same numbers and writes typed ones into the text.
    const cell = page.getByLabel("Fan point 3 duty (%)");
    await expect(cell).toHaveValue(String(p.dutyPct - 5));
    await cell.fill("97.5");
    await cell.press("Enter");
    await expect.poll(async () => (JSON.parse(await editorText(page)) as Doc).fans.points[2]!.dutyPct).toBe(97.5);
    await expectAccessible(page);
  });

  test("adding and removing points, by button, double-click and the Delete key", async ({ page }) => {
    await openFreshProfile(page);
    const before = await editorText(page);
    await page.getByRole("button", { name: "Add fan point" }).click();
    // Starter fan points at 25, 40, 55 °C: the widest gap is the first (a tie is broken by the first), middle 32.5 °C.
    await expect.poll(async () => (JSON.parse(await editorText(page)) as Doc).fans.points.map((q) => q.tempC)).toEqual([25, 32.5, 40, 55]);
    await expect(page.getByRole("slider", { name: /^fan point \d+$/ })).toHaveCount(4);
    // Delete on the new point's handle takes it out again, leaving the text exactly as before.
    await page.getByRole("slider", { name: "fan point 2" }).focus();
    await page.keyboard.press("Delete");
    await expect.poll(() => editorText(page)).toBe(before);

    // Double-click on the plot near the pump curve between 40 and 55 °C adds a pump point there.
    const a = (await page.getByRole("slider", { name: "pump point 2" }).boundingBox())!;
    const b = (await page.getByRole("slider", { name: "pump point 3" }).boundingBox())!;
    await page.mouse.dblclick((a.x + b.x) / 2 + a.width / 2, (a.y + b.y) / 2 + a.height / 2);
    await expect.poll(async () => (JSON.parse(await editorText(page)) as Doc).pump.points.length).toBe(4);
    const added = (JSON.parse(await editorText(page)) as Doc).pump.points[2]!;
    expect(added.tempC).toBeGreaterThan(40);
    expect(added.tempC).toBeLessThan(55);
    // Two points is the least a curve keeps: removing stops there with the reason.
    await page.getByRole("button", { name: "Remove fan point 1" }).click();
    await expect.poll(async () => (JSON.parse(await editorText(page)) as Doc).fans.points.length).toBe(2);
    await page.getByRole("button", { name: "Remove fan point 1" }).click();
    await expect(page.getByTestId("edit-notice")).toContainText("at least 2 points");
    expect((JSON.parse(await editorText(page)) as Doc).fans.points.length).toBe(2);
  });

  test("a text that stops parsing while being edited keeps the plots of the last one that did, greyed, until it parses again", async ({ page }) => {
    await openFreshProfile(page);
    const chart = page.getByTestId("curve-chart");
    const text = await editorText(page);
    const doc = JSON.parse(text) as Doc;
    // A plotted edit first: the plots follow it.
    doc.fans.points[1]!.dutyPct = Math.min(100, doc.fans.points[1]!.dutyPct + 10);
    const edited = `${JSON.stringify(doc, null, 2)}\n`;
    const fanBefore = await chart.getAttribute("data-fan-rpm-40c");
    await page.evaluate((t) => window.__loopkeeperEditor!.setText(t), edited);
    await expect.poll(() => chart.getAttribute("data-fan-rpm-40c")).not.toBe(fanBefore);
    const fanEdited = await chart.getAttribute("data-fan-rpm-40c");

    // The closing brace gone: the note names the problem, and the plots are the edited text's, greyed.
    await page.evaluate((t) => window.__loopkeeperEditor!.setText(t), edited.trimEnd().slice(0, -1));
    await expect(page.getByTestId("stale-plots")).toContainText(/The JSON has a problem at line \d+, column \d+/);
    await expect(chart).toHaveAttribute("data-fan-rpm-40c", fanEdited!);
    await expect(page.getByRole("slider", { name: "fan point 2" })).toHaveCount(0);

    await page.evaluate((t) => window.__loopkeeperEditor!.setText(t), text);
    await expect(page.getByTestId("stale-plots")).toHaveCount(0);
    await expect(chart).toHaveAttribute("data-fan-rpm-40c", fanBefore!);
  });
});
