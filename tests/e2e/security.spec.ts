// Sign-in in a real browser, against OWASP ASVS 4.0.3:
// V5.1.5 (redirects only to allowed destinations), V8.3.1 (sensitive data only in the body,
// never in the query string) and V7.4.1 (no database text in any page, redirect or body).
import { expect, test } from "@playwright/test";
import { ACCOUNTS, DEMO_PASSWORD, signInRequest } from "./support/accounts";

const DATABASE_TEXT = /select|insert|where|constraint|postgres|invalid byte sequence|0x00|params|query/i;

test.describe("ASVS 5.1.5 — sign-in never forwards to another site", () => {
  for (const callbackUrl of ["/\\evil.example/x", "/%09/evil.example", "//evil.example/", "https://evil.example/"]) {
    test(`callbackUrl=${callbackUrl} stays on this origin`, async ({ page, baseURL }) => {
      // The raw value goes into the query as an attacker would write the link.
      await page.goto(`/sign-in?callbackUrl=${callbackUrl.startsWith("/%") ? callbackUrl : encodeURIComponent(callbackUrl)}`);
      await page.getByLabel("E-mail").fill(ACCOUNTS.viewer);
      await page.getByLabel("Password").fill(DEMO_PASSWORD);
      await page.getByRole("button", { name: "Sign in" }).click();
      await page.waitForURL((u) => !u.pathname.startsWith("/sign-in"));
      expect(new URL(page.url()).origin).toBe(new URL(baseURL!).origin);
    });
  }
});

test.describe("ASVS 8.3.1 — the sign-in form never puts the password in a URL", () => {
  test.use({ javaScriptEnabled: false });

  test("pressed before scripts run, the form posts (never a GET with the password) and signs in", async ({ page }) => {
    const password = DEMO_PASSWORD;
    const urls: { method: string; url: string }[] = [];
    page.on("request", (r) => urls.push({ method: r.method(), url: r.url() }));
    await page.goto("/sign-in?callbackUrl=%2Faccount");
    for (let attempt = 0; attempt < 2 && new URL(page.url()).pathname.startsWith("/sign-in"); attempt++) {
      // The first post may only pick up the form's anti-forgery cookie; the second then signs in.
      await page.getByLabel("E-mail").fill(ACCOUNTS.viewer);
      await page.getByLabel("Password").fill(password);
      await page.getByRole("button", { name: "Sign in" }).click();
      await page.waitForLoadState("load");
    }
    expect(new URL(page.url()).pathname).toBe("/account");
    const credentialPosts = urls.filter((u) => u.url.includes("/api/auth/callback/credentials"));
    expect(credentialPosts.length).toBeGreaterThan(0);
    expect(credentialPosts.every((u) => u.method === "POST")).toBe(true);
    for (const u of urls) expect(decodeURIComponent(u.url)).not.toContain(password);
  });
});

test.describe("ASVS 7.4.1 — a NUL in the sign-in e-mail gives the generic failure, no database text", () => {
  test("the redirect after a hostile sign-in names no query, parameter or PostgreSQL detail", async ({ request }) => {
    const csrf = (await (await request.get("/api/auth/csrf")).json()) as { csrfToken: string };
    const res = await request.post("/api/auth/callback/credentials", {
      form: { csrfToken: csrf.csrfToken, email: "admin\u0000@tarnwell.example", password: "x", json: "true" },
      maxRedirects: 0,
    });
    const body = await res.text();
    expect(res.status()).toBeLessThan(500);
    expect(decodeURIComponent(body)).not.toMatch(DATABASE_TEXT);
    expect(body).toMatch(/error=CredentialsSignin/);
  });
});

test.describe("ASVS 3.3.1 / 3.3.3 — sessions end on the server", () => {
  test("after sign-out, a copy of the session cookie is refused", async ({ page, browser }) => {
    await page.goto("/sign-in");
    await page.getByLabel("E-mail").fill(ACCOUNTS.viewer);
    await page.getByLabel("Password").fill(DEMO_PASSWORD);
    await page.getByRole("button", { name: "Sign in" }).click();
    await page.waitForURL((u) => !u.pathname.startsWith("/sign-in"));
    const copied = await page.context().cookies();
    await page.goto("/account");
    await page.getByRole("button", { name: "Sign out" }).click();
    await page.waitForURL(/\/sign-in/);
    // Someone who kept the cookie (another tab, a stolen copy) is refused by the server.
    const other = await browser.newContext();
    await other.addCookies(copied);
    expect((await other.request.get("/api/v1/me")).status()).toBe(401);
    await other.close();
  });

  test("a password change signs out the user's other sessions and keeps this one", async ({ playwright, baseURL }) => {
    const admin = await playwright.request.newContext({ baseURL });
    await signInRequest(admin, ACCOUNTS.admin);
    const email = `sessions-${Date.now()}@tarnwell.example`;
    const first = "quartz-ledger-kettle-58";
    expect((await admin.post("/api/v1/users", { data: { email, name: "Session Holder", role: "viewer", password: first } })).status()).toBe(201);
    const here = await playwright.request.newContext({ baseURL });
    const elsewhere = await playwright.request.newContext({ baseURL });
    await signInRequest(here, email, first);
    await signInRequest(elsewhere, email, first);
    const res = await here.post("/api/v1/me/password", { data: { currentPassword: first, newPassword: "moraine-teapot-lantern-93" } });
    expect(res.status()).toBe(200);
    expect(((await res.json()) as { otherSessionsEnded: number }).otherSessionsEnded).toBeGreaterThanOrEqual(1);
    expect((await elsewhere.get("/api/v1/me")).status()).toBe(401);
    expect((await here.get("/api/v1/me")).status()).toBe(200);
    for (const c of [admin, here, elsewhere]) await c.dispose();
  });
});

test.describe("ASVS 14.4.3 — a Content-Security-Policy without 'unsafe-inline' or 'unsafe-eval' for scripts", () => {
  test("the editor (Monaco) and the plots work under the screen policy, with no violation reported", async ({ page }) => {
    const violations: string[] = [];
    page.on("console", (m) => {
      if (/Content Security Policy|Content-Security-Policy/i.test(m.text())) violations.push(m.text());
    });
    await page.addInitScript(() => {
      document.addEventListener("securitypolicyviolation", (e) => console.error(`Content Security Policy violation: ${e.violatedDirective} ${e.blockedURI} at ${e.sourceFile}:${e.lineNumber}:${e.columnNumber} ${e.sample}`));
    });
    const signIn = await page.goto("/sign-in");
    const policy = signIn?.headers()["content-security-policy"] ?? "";
    const scriptSrc = policy.split(";").map((d) => d.trim()).find((d) => d.startsWith("script-src")) ?? "";
    expect(scriptSrc).toMatch(/'nonce-[A-Za-z0-9+/=]{16,}'/);
    expect(scriptSrc).not.toContain("unsafe-inline");
    expect(scriptSrc).not.toContain("unsafe-eval");
    // A fresh nonce per response.
    const again = (await page.request.get("/sign-in")).headers()["content-security-policy"];
    expect(again).not.toBe(policy);

    await page.getByLabel("E-mail").fill(ACCOUNTS.engineer);
    await page.getByLabel("Password").fill(DEMO_PASSWORD);
    await page.getByRole("button", { name: /sign in/i }).click();
    await page.waitForURL((u) => !u.pathname.startsWith("/sign-in"));
    await page.goto("/profiles");
    await page.waitForLoadState("networkidle");
    const href = await page.locator("a[href]").evaluateAll((as) => as.map((a) => a.getAttribute("href") ?? "").find((h) => /^\/profiles\/[0-9a-f-]{36}$/.test(h)));
    expect(href).toBeTruthy();
    await page.goto(href!);
    await expect(page.locator(".monaco-editor").first()).toBeVisible({ timeout: 20_000 });
    await expect(page.getByTestId("curve-chart")).toBeVisible();
    // Monaco rendered the document with its tokenizer, and the plot drew: their scripts ran under the policy.
    await expect(page.locator(".monaco-editor .view-lines")).toContainText('"pump"');
    expect(violations).toEqual([]);
  });

  test("API answers carry a policy that allows nothing to load or run", async ({ request }) => {
    const res = await request.get("/api/health/live");
    expect(res.headers()["content-security-policy"]).toContain("default-src 'none'");
  });
});
