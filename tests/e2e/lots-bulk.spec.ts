import { expect, test } from "@playwright/test";
import { ACCOUNTS, signInPage } from "./support/accounts";
import { LotsPage, type ProgressSample } from "./pages/support";
import { bulkLotsCsv, countLotsTagged, deleteLotsTagged, freeTc1Base, tc1Serial, withTestDb } from "./support/lots-csv";

/**
 * A factory-size lots file (100,000 one-board lots, about 6 MB) through the lots page, as a
 * release manager does it: preview, then import, with the progress bar moving while the server
 * checks and writes the rows. Each file is made here, in a block of TC-1 serials no demo lot or
 * other test uses, and every lot a test recorded is deleted after it, so the lists and lookups
 * other specs read are as the demo data left them.
 *
 * Nothing here is timed: a loaded machine may take minutes, so the test and its waits get that
 * long, and the assertions are about order and the states drawn, not speed.
 */

const ROWS = 100_000;
/** TC-1 serials from here to SERIALS_TO are this file's (above the integration tests' block). */
const SERIALS_FROM = 92_000_000;
const SERIALS_TO = 97_999_999;
const LONG = 15 * 60_000;
const WAIT = { timeout: 12 * 60_000 };

/** The row counts ("3,000 of 100,000") a phase's bar showed, in the order drawn. */
function countsShown(samples: ProgressSample[], phase: "Checking rows" | "Recording lots"): { done: number; total: number }[] {
  return samples.flatMap((s) => {
    const m = s.label?.match(new RegExp(`^${phase}: ([\\d,]+) of ([\\d,]+)$`));
    return m ? [{ done: Number(m[1]!.replace(/,/g, "")), total: Number(m[2]!.replace(/,/g, "")) }] : [];
  });
}

/**
 * The bar moved while the server worked: several different counts short of the total were drawn,
 * in rising order, each before the outcome was on the page. A response held back until the end
 * (buffered by compression, a proxy or the framework) draws at most its last count.
 */
function expectMovedWhileWorking(samples: ProgressSample[], phase: "Checking rows" | "Recording lots", total: number): void {
  const shown = countsShown(samples, phase);
  expect(shown.every((s) => s.total === total), `${phase}: every count is out of ${total}`).toBe(true);
  const done = shown.map((s) => s.done);
  expect(done, `${phase}: counts drawn in rising order`).toEqual([...done].sort((a, b) => a - b));
  const partial = new Set(done.filter((n) => n > 0 && n < total));
  expect(partial.size, `${phase}: distinct partial counts drawn (${[...partial].join(", ")})`).toBeGreaterThanOrEqual(3);
  const withLabel = samples.filter((s) => s.label?.startsWith(phase));
  expect(withLabel.every((s) => !s.finished), `${phase}: drawn before the outcome`).toBe(true);
}

test.describe("lots CSV import at factory size", () => {
  const tags: string[] = [];
  test.afterEach(async () => {
    for (const tag of tags.splice(0)) await deleteLotsTagged(tag);
  });

  test("100,000 rows preview and import with the progress moving while the server checks and writes them", async ({ page }) => {
    test.setTimeout(LONG);
    const tag = `BULK${Date.now() % 1_000_000}`;
    tags.push(tag);
    const base = await freeTc1Base(SERIALS_FROM, SERIALS_TO);
    expect(base + ROWS - 1).toBeLessThanOrEqual(SERIALS_TO);

    await signInPage(page, ACCOUNTS.release_manager);
    const lots = await new LotsPage(page).goto();
    await lots.chooseCsv("factory-100k.csv", bulkLotsCsv(tag, base, ROWS));

    // Preview: every row is checked against the database, nothing is recorded.
    await lots.watchProgress();
    await lots.previewButton.click();
    await expect(lots.importOutcome).toContainText("All 100,000 row(s) are valid. Nothing is recorded until you press Import.", WAIT);
    const preview = await lots.progressSeen();
    expect(preview.some((s) => s.label === "Sending factory-100k.csv"), "the bar showed the file going out").toBe(true);
    expectMovedWhileWorking(preview, "Checking rows", ROWS);
    expect(countsShown(preview, "Recording lots"), "a preview writes nothing").toEqual([]);
    expect(preview.at(-1)).toEqual({ label: null, percent: null, finished: true });
    expect(await countLotsTagged(tag)).toBe(0);

    // Import: checked again inside the one transaction, then written a batch at a time.
    await lots.importButton.click();
    await expect(lots.importOutcome).toHaveText("Imported 100,000 lot(s).", WAIT);
    const run = await lots.progressSeen();
    expectMovedWhileWorking(run, "Checking rows", ROWS);
    expectMovedWhileWorking(run, "Recording lots", ROWS);
    // Checking ends before writing starts, and the percentage never goes back.
    const firstWrite = run.findIndex((s) => s.label?.startsWith("Recording lots"));
    const lastCheck = run.findLastIndex((s) => s.label?.startsWith("Checking rows"));
    expect(lastCheck).toBeLessThan(firstWrite);
    const percents = run.filter((s) => s.label?.startsWith("Checking rows") || s.label?.startsWith("Recording lots")).map((s) => s.percent ?? -1);
    expect(percents).toEqual([...percents].sort((a, b) => a - b));

    // Every row is in the database, first and last serial as the file gave them.
    const stored = await withTestDb(async (db) =>
      (await db.query<{ n: number; first: string; last: string }>(`select count(*)::int as n, min(serial_from) as first, max(serial_to) as last from production_lots where lot_code like $1`, [`${tag}-%`])).rows[0],
    );
    expect(stored).toEqual({ n: ROWS, first: String(base), last: String(base + ROWS - 1) });
  });

  test("a row that became bad between preview and import stops the whole 100,000-row import: nothing is recorded", async ({ page }) => {
    test.setTimeout(LONG);
    const tag = `BULKBAD${Date.now() % 1_000_000}`;
    const colleague = `${tag}C`;
    tags.push(tag, colleague);
    const base = await freeTc1Base(SERIALS_FROM, SERIALS_TO);
    expect(base + ROWS - 1).toBeLessThanOrEqual(SERIALS_TO);
    // Data row 70,000 (line 70,001 of the file, after the header).
    const clash = base + 69_999;

    await signInPage(page, ACCOUNTS.release_manager);
    const lots = await new LotsPage(page).goto();
    await lots.chooseCsv("factory-clash.csv", bulkLotsCsv(tag, base, ROWS));
    await lots.previewButton.click();
    await expect(lots.importOutcome).toContainText("All 100,000 row(s) are valid.", WAIT);

    // Meanwhile a colleague records one board of row 70,000's serials by hand.
    const recorded = await page.request.post("/api/v1/lots", {
      data: { lotCode: `${colleague}-1`, boardRevision: "1.1.0", buildVersion: "3.1.0", serialFrom: tc1Serial(clash), serialTo: tc1Serial(clash), producedOn: "2025-06-02", line: "Line C" },
    });
    expect(recorded.status(), await recorded.text()).toBe(201);

    await lots.watchProgress();
    await lots.importButton.click();
    await expect(lots.importOutcome).toContainText("factory-clash.csv: 1 problem(s); nothing was imported", WAIT);
    const row = lots.importProblems.getByRole("row").filter({ hasText: `overlap lot ${colleague}-1` });
    await expect(row).toHaveCount(1);
    await expect(row.getByRole("cell").first()).toHaveText("70001");
    await expect(row).toContainText("serial_from");
    await expect(lots.importButton).toBeDisabled();

    // The import checked every row while the bar moved, and never began writing.
    const run = await lots.progressSeen();
    expectMovedWhileWorking(run, "Checking rows", ROWS);
    expect(countsShown(run, "Recording lots")).toEqual([]);
    expect(await countLotsTagged(tag)).toBe(0);
    expect(await countLotsTagged(colleague)).toBe(1);
  });
});
