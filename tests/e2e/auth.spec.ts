import { expect, test } from "@playwright/test";
import { ROLES } from "./access/types";
import { ACCOUNTS, signInPage } from "./support/accounts";
import { UsersAdmin } from "./pages/admin";

test.describe("sign-in", () => {
  for (const role of ROLES) {
    test(`${role} signs in, navigates and signs out`, async ({ page }) => {
      await signInPage(page, ACCOUNTS[role]);
      await expect(page.getByRole("heading", { name: "Dashboard" })).toBeVisible();
      await expect(page.getByTestId("current-user")).toBeVisible();
      const adminLink = page.getByRole("link", { name: "Users and roles" });
      if (role === "admin") {
        await adminLink.click();
        await expect(page.getByRole("heading", { name: "Users and roles" })).toBeVisible();
      } else {
        await expect(adminLink).toHaveCount(0);
        // Typing the address does not help: the server refuses the page for this role.
        const res = await page.goto("/admin/users");
        expect(res?.status()).toBe(403);
        await expect(page.getByRole("heading", { name: "Not for your role" })).toBeVisible();
      }
      await page.goto("/account");
      await page.getByRole("button", { name: "Sign out" }).click();
      await page.waitForURL(/\/sign-in/);
      await page.goto("/account");
      await expect(page).toHaveURL(/\/sign-in/);
    });
  }

  test("a wrong password shows the same generic error as an unknown account", async ({ page }) => {
    await page.goto("/sign-in");
    await page.getByLabel("E-mail").fill(ACCOUNTS.viewer);
    await page.getByLabel("Password").fill("not-the-password");
    await page.getByRole("button", { name: "Sign in" }).click();
    const error = page.getByTestId("sign-in-error");
    await expect(error).toContainText("Sign-in failed");
    const wrongPassword = await error.innerText();
    await page.getByLabel("E-mail").fill("nobody@tarnwell.example");
    await page.getByRole("button", { name: "Sign in" }).click();
    await expect(error).toHaveText(wrongPassword);
    await expect(page).toHaveURL(/\/sign-in/);
  });

  test("a disabled user is shut out, including an open session", async ({ browser }) => {
    const email = `temp-${Date.now()}@tarnwell.example`;
    const adminPage = await browser.newPage();
    await signInPage(adminPage, ACCOUNTS.admin);
    const admin = await new UsersAdmin(adminPage).goto();
    await admin.add({ name: "Temporary Tester", email, role: "viewer", password: "temporary-password-1" });
    await expect(adminPage.getByRole("cell", { name: email })).toBeVisible();

    const user = await browser.newPage();
    await signInPage(user, email, "temporary-password-1");
    await expect(user.getByRole("heading", { name: "Dashboard" })).toBeVisible();

    const row = admin.row(email);
    // A role change waits for confirmation; cancelling leaves the role as it was.
    await row.getByLabel("Role of Temporary Tester").selectOption("support");
    const roleDialog = admin.dialog("Change Temporary Tester's role to Support?");
    await roleDialog.getByRole("button", { name: "Cancel" }).click();
    await expect(row.getByLabel("Role of Temporary Tester")).toHaveValue("viewer");

    await admin.disable(email);
    const dialog = admin.dialog("Disable Temporary Tester's account?");
    await expect(dialog).toContainText(email);
    await expect(row.getByText("active")).toBeVisible();
    await dialog.getByRole("button", { name: "Disable account" }).click();
    await expect(row.getByText("disabled")).toBeVisible();

    // The open session stops working at its next request.
    await user.goto("/account");
    await expect(user).toHaveURL(/\/sign-in/);
    // And signing in again fails with the generic message.
    await user.getByLabel("E-mail").fill(email);
    await user.getByLabel("Password").fill("temporary-password-1");
    await user.getByRole("button", { name: "Sign in" }).click();
    await expect(user.getByTestId("sign-in-error")).toContainText("Sign-in failed");
  });

  test("revoking an API token asks first, naming the token, and then refuses it", async ({ page, playwright, baseURL }) => {
    const name = `Dialog station ${Date.now()}`;
    await signInPage(page, ACCOUNTS.support);
    await page.goto("/account");
    await page.getByLabel("Name", { exact: true }).fill(name);
    await page.getByRole("button", { name: "Create token" }).click();
    const secret = (await page.getByTestId("new-token-secret").textContent())?.trim() ?? "";
    expect(secret.length).toBeGreaterThan(20);
    const row = page.getByRole("row").filter({ hasText: name });
    await row.getByRole("button", { name: `Revoke ${name}` }).click();
    const dialog = page.getByRole("dialog", { name: `Revoke the token "${name}"?` });
    await expect(dialog).toContainText("cannot be undone");
    // Escape closes it and nothing happens.
    await page.keyboard.press("Escape");
    await expect(dialog).toBeHidden();
    const station = await playwright.request.newContext({ baseURL, extraHTTPHeaders: { authorization: `Bearer ${secret}` } });
    expect((await station.get("/api/v1/me")).status()).toBe(200);
    await row.getByRole("button", { name: `Revoke ${name}` }).click();
    await dialog.getByRole("button", { name: "Revoke token" }).click();
    await expect(row.getByText("revoked")).toBeVisible();
    expect((await station.get("/api/v1/me")).status()).toBe(401);
    await station.dispose();
  });
});
