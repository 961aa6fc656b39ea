import { expect, test } from "@playwright/test";
import { ACCOUNTS, signInPage } from "./support/accounts";
import { bulkLotsCsv, countLotsTagged } from "./support/lots-csv";
import { LotsPage } from "./pages/support";

test.describe("a draft that stopped being valid JSON", () => {
  test("reopens showing the syntax problem at its line and column, and the last plots greyed with a note", async ({ page }) => {
    await signInPage(page, ACCOUNTS.engineer);
    await page.goto("/profiles");
    await page.getByLabel("Cooler model", { exact: true }).last().selectOption({ label: "Tarn 360" });
    await page.getByLabel("Profile name").fill(`Broken draft ${Date.now()}`);
    await page.getByRole("button", { name: "Create and open the editor" }).click();
    await page.waitForURL(/\/profiles\/[0-9a-f-]{36}$/);
    const id = page.url().split("/").pop()!;
    await expect(page.getByTestId("curve-chart")).toBeVisible();
    await expect(page.getByTestId("stale-plots")).toHaveCount(0);

    // Break the saved draft on its third line (a missing value), as an interrupted edit leaves it.
    const detail = (await (await page.request.get(`/api/v1/profiles/${id}`)).json()) as { profile: { draftText: string; draftRevision: number } };
    const lines = detail.profile.draftText.split("\n");
    lines[2] = lines[2]!.replace(/:\s*.*$/, ": ,");
    const broken = lines.join("\n");
    expect((await page.request.put(`/api/v1/profiles/${id}/draft`, { data: { text: broken, baseRevision: detail.profile.draftRevision } })).status()).toBe(200);

    await page.reload();
    const note = page.getByTestId("stale-plots");
    await expect(note).toContainText(/The JSON has a problem at line 3, column \d+/);
    await expect(note).toContainText("greyed plots are from the last version of the draft");
    await expect(page.getByTestId("curve-chart")).toBeVisible();
    await expect(page.getByTestId("problems")).toContainText("3:");
  });
});

test.describe("serial lookup links", () => {
  test("lead from the result to its build, lot, board revision and profile", async ({ page }) => {
    await signInPage(page, ACCOUNTS.support);
    await page.goto("/lookup");
    await page.getByLabel("Serial number").fill("tc1-12345");
    await page.getByRole("button", { name: "Look up" }).click();
    await expect(page.getByRole("heading", { name: "Serial TC1-00012345" })).toBeVisible();
    const slot = page.getByRole("heading", { name: /^Slot 1: / }).getByRole("link");
    await expect(slot).toHaveAttribute("href", /^\/profiles\/[0-9a-f-]{36}$/);
    await expect(page.getByRole("link", { name: "TW-2501" })).toHaveAttribute("href", "/lots?code=TW-2501");
    await expect(page.getByRole("link", { name: /^\d+\.\d+\.\d+$/ }).first()).toHaveAttribute("href", /^\/board-revisions\/[0-9a-f-]{36}$/);

    // The build the board shipped with comes first; newer builds are listed further down.
    const buildLink = page.getByRole("link", { name: /^Build \d/ }).first();
    const label = (await buildLink.textContent())!;
    const version = label.replace(/^Build /, "");
    await buildLink.click();
    await page.waitForURL(/\/builds\/[0-9a-f-]{36}$/);
    await expect(page.getByRole("heading", { level: 1 })).toContainText(version);
  });
});

test.describe("tach support", () => {
  test("the converter flags a speed the pump cannot run, and the board page explains its tach pulses", async ({ page }) => {
    await signInPage(page, ACCOUNTS.support);
    await page.goto("/lookup");
    await page.getByLabel("Serial number").fill("tc1-12345");
    await page.getByRole("button", { name: "Look up" }).click();
    await expect(page.getByRole("heading", { name: "Serial TC1-00012345" })).toBeVisible();
    // Brook D3 pump in the demo registry: 1,400 RPM at its minimum duty, 2,900 RPM at most, 4 pulses per revolution.
    await expect(page.getByText("This pump runs 1,400–2,900 RPM by its datasheet.")).toBeVisible();
    await expect(page.getByLabel("Motor pulses per revolution")).toHaveValue("4");
    await page.getByLabel("Reading the customer sees (RPM)").fill("5600");
    await expect(page.getByTestId("tach-finding")).toHaveCount(0);
    // Converted as if the pump gave 2 pulses, 5,600 RPM is twice what it can run.
    await page.getByLabel("Motor pulses per revolution").fill("2");
    await expect(page.getByTestId("tach-finding")).toContainText("pulses per revolution (2) are probably wrong");
    await page.getByLabel("Motor pulses per revolution").fill("4");
    await page.getByLabel("Reading the customer sees (RPM)").fill("900");
    await expect(page.getByTestId("tach-finding")).toContainText("may be failing");

    await page.getByRole("link", { name: /^\d+\.\d+\.\d+$/ }).first().click();
    await expect(page.getByTestId("tach-explanation")).toContainText("counts 2 pulses per revolution");
    await expect(page.getByText(/^0x[0-9A-F]{8}$/).first()).toBeVisible();
  });
});

test.describe("links and lists", () => {
  test("dashboard stage tiles open the builds list of that stage", async ({ page }) => {
    await signInPage(page, ACCOUNTS.viewer);
    await page.goto("/");
    const count = Number(await page.getByTestId("stage-count-withdrawn").textContent());
    expect(count).toBeGreaterThan(0);
    await page.getByRole("link", { name: /^Withdrawn: \d+ builds?, show them$/ }).click();
    await page.waitForURL(/\/builds\?stage=withdrawn$/);
    await expect(page.getByText("Showing builds at Withdrawn only.")).toBeVisible();
    await expect(page.getByTestId("pipeline-withdrawn").getByRole("link")).toHaveCount(count);
    await expect(page.getByTestId("pipeline-draft")).toHaveCount(0);
    await page.getByRole("link", { name: "Show every stage" }).click();
    await expect(page.getByTestId("pipeline-draft")).toBeVisible();
  });

  test("a lot links to its build, and the withdrawn list says when and by whom", async ({ page }) => {
    await signInPage(page, ACCOUNTS.support);
    await page.goto("/lots?code=TW-2502");
    await page.getByRole("link", { name: "Build 3.0.1" }).click();
    await page.waitForURL(/\/builds\/[0-9a-f-]{36}$/);
    await expect(page.getByRole("heading", { level: 1 })).toContainText("3.0.1");
    // Slot profile names lead to that version's row in the profile's history.
    const slotLink = page.getByRole("link", { name: "Quiet 1.1.0" });
    await expect(slotLink).toHaveAttribute("href", /^\/profiles\/[0-9a-f-]{36}#version-1\.1\.0$/);
    await slotLink.click();
    await expect(page.locator("#version-1\\.1\\.0")).toBeVisible();

    await page.goto("/support/withdrawn");
    const row = page.getByRole("row").filter({ has: page.getByRole("link", { name: /3\.0\.1$/ }) });
    await expect(row.getByTestId("withdrawn-when")).toContainText(/\d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC/);
    await expect(row.getByTestId("withdrawn-when")).toContainText("by Sunniva Kalt");
  });

  test("the audit log finds a role change by the admin's name in any case, reads as a sentence and links the user", async ({ page }) => {
    await signInPage(page, ACCOUNTS.admin);
    const email = `role-${Date.now()}@tarnwell.example`;
    const created = await page.request.post("/api/v1/users", { data: { email, name: "Runa Rolle", role: "viewer", password: "a long and unusual demo passphrase 7" } });
    expect(created.status()).toBe(201);
    const { user } = (await created.json()) as { user: { id: string } };
    expect((await page.request.patch(`/api/v1/users/${user.id}`, { data: { role: "support" } })).status()).toBe(200);

    await page.goto("/admin/audit");
    await page.getByLabel("Who").fill("iLSE bRAND");
    await page.getByLabel("Action contains").fill("USER.ROLE_CHANGE");
    const today = new Date().toISOString().slice(0, 10);
    await page.getByLabel("From (UTC day)").fill(today);
    await page.getByLabel("To (UTC day)").fill(today);
    await page.getByRole("button", { name: "Filter" }).click();
    const row = page.getByRole("row").filter({ hasText: `Ilse Brandvold changed the role of Runa Rolle (${email}) from viewer to support` });
    await expect(row).toBeVisible();
    await expect(row).toContainText(/UTC/);
    await expect(row.getByRole("link", { name: `Runa Rolle (${email})` })).toHaveAttribute("href", "/admin/users");
  });
});

test.describe("uploads", () => {
  test("an upload shows its progress and can be cancelled, and a cancelled import records nothing", async ({ page }) => {
    test.setTimeout(300_000);
    await signInPage(page, ACCOUNTS.release_manager);
    const lots = await new LotsPage(page).goto();
    const tag = `CANCEL${Date.now() % 1_000_000}`;
    // Held at the network until the test lets go, so Cancel is pressed while the upload is under way.
    let release: () => void = () => {};
    const held = new Promise<void>((resolve) => (release = resolve));
    await page.route("**/api/v1/lots/import/progress**", async (route) => {
      await held;
      await route.continue().catch(() => undefined);
    });
    await lots.chooseCsv("cancel-me.csv", bulkLotsCsv(tag, 20_000_000, 5_000));
    await lots.previewButton.click();
    await expect(lots.progressBar).toBeVisible();
    await expect(lots.progressPercent).toHaveText(/^\d+ %$/);
    await lots.cancelUpload.click();
    await expect(lots.uploadCancelled).toHaveText("cancel-me.csv: Cancelled; nothing was saved.");
    await expect(lots.progressBar).toHaveCount(0);
    release();
    await expect(lots.previewButton).toBeEnabled();
    expect(await countLotsTagged(tag)).toBe(0);
  });
});
