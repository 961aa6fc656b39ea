import type { APIRequestContext, Page } from "@playwright/test";
import type { RoleName } from "../access/types";

/** Demo accounts seeded by db/seed (invented people). */
export const DEMO_PASSWORD = "loopkeeper-demo";
export const ACCOUNTS: Record<RoleName, string> = {
  admin: "admin@tarnwell.example",
  engineer: "engineer@tarnwell.example",
  release_manager: "release@tarnwell.example",
  support: "support@tarnwell.example",
  viewer: "viewer@tarnwell.example",
};

/** Signs in through next-auth's credentials endpoint; the context keeps the session cookie. */
export async function signInRequest(request: APIRequestContext, email: string, password = DEMO_PASSWORD): Promise<void> {
  const csrf = (await (await request.get("/api/auth/csrf")).json()) as { csrfToken: string };
  const res = await request.post("/api/auth/callback/credentials", {
    form: { csrfToken: csrf.csrfToken, email, password, json: "true" },
    maxRedirects: 0,
  });
  if (![200, 302].includes(res.status())) throw new Error(`sign-in of ${email} answered ${res.status()}`);
  const me = await request.get("/api/v1/me");
  if (me.status() !== 200) throw new Error(`sign-in of ${email} did not create a session`);
}

/** Signs in through the real form, as a person would. */
export async function signInPage(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL((u) => !u.pathname.startsWith("/sign-in"));
}
