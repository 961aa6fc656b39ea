import { expect, test } from "@playwright/test";
import { expectAccessible } from "./support/a11y";
import { ACCOUNTS, signInPage } from "./support/accounts";

/** The main screens, each checked with axe once its data has loaded. */
const SCREENS: { path: string; heading: string | RegExp }[] = [
  { path: "/", heading: "Dashboard" },
  { path: "/account", heading: "Your account" },
  { path: "/admin/users", heading: "Users and roles" },
  { path: "/admin/audit", heading: "Audit log" },
];

test("sign-in page has no serious accessibility violations", async ({ page }) => {
  await page.goto("/sign-in");
  await expectAccessible(page);
});

for (const screen of SCREENS) {
  test(`${screen.path} has no serious accessibility violations`, async ({ page }) => {
    await signInPage(page, ACCOUNTS.admin);
    await page.goto(screen.path);
    await expect(page.getByRole("heading", { level: 1, name: screen.heading })).toBeVisible();
    await page.waitForLoadState("networkidle");
    await expectAccessible(page);
  });
}

test("sign-in and token creation work with the keyboard alone", async ({ page }) => {
  await page.goto("/sign-in");
  await page.keyboard.type(ACCOUNTS.engineer); // the e-mail field has focus on arrival
  await page.keyboard.press("Tab");
  await page.keyboard.type("loopkeeper-demo");
  await page.keyboard.press("Enter");
  await page.waitForURL((u) => !u.pathname.startsWith("/sign-in"));
  await page.goto("/account");
  await page.getByLabel("Name").focus();
  await page.keyboard.type("Keyboard only");
  await page.keyboard.press("Tab");
  await page.keyboard.press("Control+A");
  await page.keyboard.type("30");
  await page.keyboard.press("Enter");
  await expect(page.getByTestId("new-token-secret")).toBeVisible();
});
