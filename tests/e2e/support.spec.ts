import zlib from "node:zlib";
import { expect, request as playwrightRequest, test, type APIRequestContext } from "@playwright/test";
import { Client } from "pg";
import { writeIntelHex } from "../../lib/engine";
import { ACCOUNTS, signInPage, signInRequest } from "./support/accounts";
import { LookupPage, LotsPage } from "./pages/support";

/** The bank image of a seeded demo build, read straight from the test database. */
async function demoBankImage(version: string): Promise<{ bytes: Buffer; baseAddress: number }> {
  const db = new Client({ connectionString: process.env.DATABASE_URL });
  await db.connect();
  try {
    const r = await db.query(
      `select b.bank_image, min(r.base_address) as base from builds b join board_models m on m.id = b.board_model_id
         join board_revisions r on r.board_model_id = m.id where m.serial_prefix = 'TC1' and b.version = $1 group by b.id`,
      [version],
    );
    const row = r.rows[0] as { bank_image: Buffer; base: string };
    return { bytes: row.bank_image, baseAddress: Number(row.base) };
  } finally {
    await db.end();
  }
}

async function tokenFor(baseURL: string | undefined, email: string): Promise<{ ctx: APIRequestContext; secret: string }> {
  const ctx = await playwrightRequest.newContext({ baseURL });
  await signInRequest(ctx, email);
  const created = (await (await ctx.post("/api/v1/tokens", { data: { name: "support e2e", expiresInDays: 1 } })).json()) as { secret: string };
  return { ctx, secret: created.secret };
}

test.describe("support lookup", () => {
  test.beforeEach(async ({ page }) => {
    await signInPage(page, ACCOUNTS.support);
  });

  test("a demo serial shows its build, curves, newer build and the tach converter", async ({ page }) => {
    await page.getByRole("link", { name: "Serial lookup" }).click();
    const lookup = new LookupPage(page);
    await lookup.lookUp("tc1-12345");
    await expect(page.getByRole("heading", { name: "Serial TC1-00012345" })).toBeVisible();
    await expect(page.getByText("TW-2501", { exact: true })).toBeVisible();
    await expect(page.getByRole("heading", { name: "Slot 1: Quiet 1.0.0" })).toBeVisible();
    // recharts draws the curves lazily once the result is on screen.
    await expect(page.locator("figure .recharts-surface").first()).toBeVisible();
    await expect(page.getByText("Build 3.1.0", { exact: true })).toBeVisible();
    await expect(page.getByText("Estimates, not measurements")).toBeVisible();
    // Brook D3 pump gives 4 pulses per revolution: a reading of 5,600 RPM is 2,800 RPM real.
    await expect(page.getByLabel("Motor pulses per revolution")).toHaveValue("4");
    await page.getByLabel("Reading the customer sees (RPM)").fill("5600");
    await expect(page.getByTestId("tach-real-rpm")).toHaveText("2,800 RPM");
    await expect(lookup.recentLookups.getByText("TC1-00012345")).toBeVisible();
  });

  test("a serial from the withdrawn build's lot shows the warning with its reason", async ({ page }) => {
    const lookup = await new LookupPage(page).goto("TC1-00031000");
    const warning = lookup.alert("Build 3.0.1 was withdrawn");
    await expect(warning).toBeVisible();
    await expect(warning).toContainText("Quiet 1.1.0");
    await expect(page.getByText(/Quiet\s*1\.1\.0 → 1\.2\.0/)).toBeVisible();
  });

  test("an unknown serial and a malformed one say so clearly", async ({ page }) => {
    const lookup = await new LookupPage(page).goto("TC1-00099999");
    await expect(lookup.alert("Not found")).toContainText("Serial TC1-00099999 was not found");
    await lookup.lookUp("hello");
    await expect(page.getByText(/"hello" is not a serial number/)).toBeVisible();
  });

  test("a good dump is identified, a corrupted one is reported corrupt", async ({ page }) => {
    const { bytes, baseAddress } = await demoBankImage("3.0.0");
    const lookup = await new LookupPage(page).goto();
    const result = await lookup.identify({ name: "returned-board.hex", mimeType: "text/plain", buffer: Buffer.from(writeIntelHex(new Uint8Array(bytes), baseAddress)) });
    await expect(result.getByText("Dump is intact")).toBeVisible();
    await expect(result.getByText("Exact registry version")).toHaveCount(2);
    await expect(result.getByText(/Quiet v1\.0\.0/)).toBeVisible();
    await expect(result.getByText("This is the bank of build 3.0.0")).toBeVisible();

    // A curve byte changed and the CRC-32 written again: intact bytes, but not the registry's version.
    const altered = Buffer.from(bytes);
    const at = 8 + 19 + 2 * 1 + 1; // slot 0, pump point 2 duty (docs/bank-format.md)
    altered[at] = altered[at]! + 4;
    altered.writeUInt32LE(zlib.crc32(altered.subarray(0, altered.length - 4)), altered.length - 4);
    await lookup.identify({ name: "altered.bin", mimeType: "application/octet-stream", buffer: altered });
    await expect(result.getByText("Altered", { exact: true })).toBeVisible();
    await expect(result.getByText("Exact registry version")).toHaveCount(1);
    await expect(result.getByTestId("dump-faults")).toContainText(`pump point 2: ${altered[at] / 2} % here, ${bytes[at]! / 2} % in v1.0.0`);

    const corrupted = Buffer.from(bytes);
    corrupted[20] = corrupted[20]! ^ 0xff;
    await lookup.identify({ name: "corrupted.bin", mimeType: "application/octet-stream", buffer: corrupted });
    await expect(result.getByText("Dump is corrupt")).toBeVisible();
    await expect(result).toContainText("CRC-32 mismatch");
  });

  test("a detached signature is chosen in the app's picker: a wrong-sized one is refused with the reason, and removing it lets the dump through", async ({ page }) => {
    const { bytes } = await demoBankImage("3.0.0");
    const lookup = await new LookupPage(page).goto();
    await lookup.chooseSignature({ name: "short.sig", mimeType: "application/octet-stream", buffer: Buffer.alloc(10, 7) });
    await expect(page.getByTestId(/-sig-chosen$/)).toContainText("short.sig");
    await expect(page.getByTestId(/-sig-chosen$/)).toContainText("10 B");
    await lookup.identify({ name: "returned-board.bin", mimeType: "application/octet-stream", buffer: Buffer.from(bytes) });
    await expect(page.getByText(/The signature file is 10 bytes; a \.sig signature block is \d+/)).toBeVisible();
    await expect(lookup.dumpResult).toHaveCount(0);
    await page.getByRole("button", { name: "Remove short.sig", exact: true }).click();
    await expect(page.getByTestId(/-sig-chosen$/)).toHaveCount(0);
    await lookup.button("Identify").click();
    await expect(lookup.dumpResult.getByText("Dump is intact")).toBeVisible();
  });
});

test.describe("lots API", () => {
  test("support and viewer tokens cannot post lots; a release manager's token can, and an overlap names the lot", async ({ baseURL }) => {
    // A fresh range each run: the test database keeps lots from earlier runs.
    const base = 1_000_000 + Math.floor(Math.random() * 200_000) * 200;
    const serial = (n: number) => `TC1-${String(n).padStart(8, "0")}`;
    const lot = { lotCode: `E2E-${base}`, boardRevision: "1.1.0", buildVersion: "3.1.0", serialFrom: serial(base), serialTo: serial(base + 99), producedOn: "2025-05-01", line: "Line E" };
    const anon = await playwrightRequest.newContext({ baseURL });
    for (const role of ["support", "viewer"] as const) {
      const { ctx, secret } = await tokenFor(baseURL, ACCOUNTS[role]);
      const res = await anon.post("/api/v1/lots", { data: lot, headers: { authorization: `Bearer ${secret}` } });
      expect(res.status(), `${role} token`).toBe(403);
      await ctx.dispose();
    }
    const { ctx, secret } = await tokenFor(baseURL, ACCOUNTS.release_manager);
    const created = await anon.post("/api/v1/lots", { data: lot, headers: { authorization: `Bearer ${secret}` } });
    expect(created.status()).toBe(201);
    const overlap = await anon.post("/api/v1/lots", { data: { ...lot, lotCode: `${lot.lotCode}b`, serialFrom: serial(base + 50), serialTo: serial(base + 150) }, headers: { authorization: `Bearer ${secret}` } });
    expect(overlap.status()).toBe(409);
    expect(((await overlap.json()) as { error: { message: string } }).error.message).toContain(`overlap lot ${lot.lotCode}`);
    const lookup = await anon.get(`/api/v1/lookup?serial=${serial(base + 42)}`, { headers: { authorization: `Bearer ${secret}` } });
    expect(lookup.status()).toBe(200);
    expect(((await lookup.json()) as { lot: { lotCode: string } }).lot.lotCode).toBe(lot.lotCode);
    await ctx.dispose();
    await anon.dispose();
  });

  test("the withdrawn build's shipped lots export as CSV", async ({ baseURL }) => {
    const ctx = await playwrightRequest.newContext({ baseURL });
    await signInRequest(ctx, ACCOUNTS.support);
    const list = (await (await ctx.get("/api/v1/support/withdrawn")).json()) as { items: { id: string; version: string; boards: number }[] };
    const withdrawn = list.items.find((b) => b.version === "3.0.1");
    expect(withdrawn?.boards).toBe(15_000);
    const csv = await ctx.get(`/api/v1/support/withdrawn/${withdrawn!.id}/shipped.csv`);
    expect(csv.headers()["content-type"]).toContain("text/csv");
    expect(await csv.text()).toContain("TW-2502,1.1.0,3.0.1,TC1-00030000,TC1-00044999,15000");
    await ctx.dispose();
  });
});

test.describe("lots page", () => {
  test("a release manager previews a CSV with a bad row: the row is listed and nothing can be imported", async ({ page }) => {
    await signInPage(page, ACCOUNTS.release_manager);
    const lots = await new LotsPage(page).goto();
    await expect(lots.lot("TW-2501")).toBeVisible();
    const base = 600_000 + (Date.now() % 1000) * 100;
    const csv = [
      "lot_code,board_revision,build_version,serial_from,serial_to,produced_on,line",
      `CSV-${base},1.1.0,3.1.0,TC1-${base},TC1-${base + 9},2025-05-02,Line A`,
      `CSV-${base + 1},1.1.0,3.1.0,TC1-${base + 10},TC1-00000001,2025-05-02,Line A`,
    ].join("\n");
    await lots.previewCsv("lots.csv", csv);
    await expect(page.getByText("1 problem(s); nothing was imported")).toBeVisible();
    await expect(lots.importProblems.getByRole("row").nth(1)).toContainText("3serial_toThe last serial must not be below the first.");
    await expect(lots.button("Import")).toBeDisabled();
  });

  test("a viewer sees the lots but no form to record them", async ({ page }) => {
    await signInPage(page, ACCOUNTS.viewer);
    const lots = await new LotsPage(page).goto();
    await expect(lots.lot("TW-2502")).toBeVisible();
    await expect(lots.recordForm).toHaveCount(0);
    await expect(lots.importForm).toHaveCount(0);
  });
});
