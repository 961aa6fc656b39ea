import { expect, test } from "@playwright/test";
import { expectAccessible } from "./support/a11y";
import { ACCOUNTS, signInPage } from "./support/accounts";

/** The main screens, each checked with axe once its data has loaded. */
const SCREENS = [
  "/",
  "/account",
  "/admin/users",
  "/admin/audit",
  "/admin/mailbox", "/admin/access",
  "/profiles",
  "/components",
  "/cooler-models",
  "/boards",
  "/builds",
  "/builds/new",
  "/lots",
  "/lookup",
  "/support/withdrawn",
];

test("sign-in page has no serious accessibility violations", async ({ page }) => {
  await page.goto("/sign-in");
  await expectAccessible(page);
});

for (const path of SCREENS) {
  test(`${path} has no serious accessibility violations`, async ({ page }) => {
    await signInPage(page, ACCOUNTS.admin);
    const res = await page.goto(path);
    expect(res?.status()).toBe(200);
    await expect(page.getByRole("heading", { level: 1 })).toBeVisible();
    await page.waitForLoadState("networkidle");
    await expectAccessible(page);
  });
}

test("the profile editor, a board revision and a build page have no serious accessibility violations", async ({ page }) => {
  test.setTimeout(90_000);
  await signInPage(page, ACCOUNTS.engineer);
  const links = [
    { list: "/profiles", href: /^\/profiles\/[0-9a-f-]{36}$/ },
    { list: "/boards", href: /^\/board-revisions\/[0-9a-f-]{36}$/ },
    { list: "/builds", href: /^\/builds\/[0-9a-f-]{36}$/ },
  ];
  for (const { list, href } of links) {
    await page.goto(list);
    await page.waitForLoadState("networkidle");
    const target = await page.locator("a[href]").evaluateAll((as, src) => as.map((a) => a.getAttribute("href") ?? "").find((h) => new RegExp(src).test(h)), href.source);
    expect(target, `a detail link on ${list}`).toBeTruthy();
    await page.goto(target!);
    await expect(page.getByRole("heading", { level: 1 })).toBeVisible();
    await page.waitForLoadState("networkidle");
    await expectAccessible(page);
  }
});

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
