import { expect, test } from "@playwright/test";
import { ACCOUNTS, signInPage } from "./support/accounts";

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
    const detail = (await (await page.request.get(`/api/v1/profiles/${id}`)).json()) as { profile: { draftText: string } };
    const lines = detail.profile.draftText.split("\n");
    lines[2] = lines[2]!.replace(/:\s*.*$/, ": ,");
    const broken = lines.join("\n");
    expect((await page.request.put(`/api/v1/profiles/${id}/draft`, { data: { text: broken } })).status()).toBe(200);

    await page.reload();
    const note = page.getByTestId("stale-plots");
    await expect(note).toContainText(/The JSON has a problem at line 3, column \d+/);
    await expect(note).toContainText("greyed plots are from the last version of the draft");
    await expect(page.getByTestId("curve-chart")).toBeVisible();
    await expect(page.getByTestId("problems")).toContainText("3:");
  });
});
