import { expect, test } from "@playwright/test";
import { DEMO_REVISIONS } from "@/db/seed/hardware";
import { ACCOUNTS, signInPage } from "./support/accounts";
import { AccountPage } from "./pages/account";
import { UsersAdmin } from "./pages/admin";
import { BuildsPipeline, NewBuildForm } from "./pages/builds";
import { DashboardPage } from "./pages/dashboard";
import { ProfileEditor, ProfilesList } from "./pages/profiles";

/** Times as every screen writes them: ISO date and minute, then the zone. */
const UTC_TIME = /\d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC/;

test.describe("API tokens on the account page", () => {
  test("the secret is shown once with a copy button, expiry says its zone and days left, and the table reads without scrolling", async ({ page, context, baseURL }) => {
    await context.grantPermissions(["clipboard-read", "clipboard-write"], { origin: baseURL });
    await signInPage(page, ACCOUNTS.support);
    const account = await new AccountPage(page).goto();
    const name = `Line 4 station ${Date.now()}`;
    await account.createToken(name, 30);

    await expect(account.newSecret).toBeVisible();
    const secret = (await account.newSecret.textContent())?.trim() ?? "";
    expect(secret.length).toBeGreaterThan(20);
    await account.expectLooksLikeButton(account.copySecret);
    await account.copySecret.click();
    await expect(account.copyStatus).toHaveText("Copied to the clipboard.");
    expect(await page.evaluate(() => navigator.clipboard.readText())).toBe(secret);

    // The row: the name, the first characters only, times with their zone, days left as made.
    await expect(await account.tokenCell(name, "Starts with")).toHaveText(/^\S{4,}…$/);
    const prefix = ((await (await account.tokenCell(name, "Starts with")).textContent()) ?? "").replace("…", "");
    expect(secret.startsWith(prefix)).toBe(true);
    await expect(await account.tokenCell(name, "Created")).toHaveText(UTC_TIME);
    await expect(await account.tokenCell(name, "Expires")).toContainText(UTC_TIME);
    await expect(await account.tokenCell(name, "Expires")).toContainText("in 30 days");
    await expect(await account.tokenCell(name, "Last used")).toHaveText("never");
    await expect(await account.tokenCell(name, "State")).toHaveText("active");
    // Readable at the default window width: every column in view, no sideways scrolling.
    const region = await account.tokensRegion.evaluate((el) => ({ scroll: el.scrollWidth, client: el.clientWidth }));
    expect(region.scroll, "the token table's width against its panel").toBeLessThanOrEqual(region.client + 1);

    // Shown once: after a reload only the prefix remains.
    await page.reload();
    await expect(account.tokenRow(name)).toBeVisible();
    await expect(account.newSecret).toHaveCount(0);
    expect(await page.content()).not.toContain(secret);
    await account.expectAccessible();
  });
});

test.describe("user admin", () => {
  test("Disable is drawn as a button, a stale error leaves after success, and a role change and a disable say what they did", async ({ page }) => {
    await signInPage(page, ACCOUNTS.admin);
    const admin = await new UsersAdmin(page).goto();
    const stamp = Date.now();
    const email = `helper-${stamp}@tarnwell.example`;
    const person = `Helga Helper ${stamp}`;

    // A refused add (the address is taken), then one that works: the old refusal is gone.
    await admin.add({ name: person, email: ACCOUNTS.viewer, role: "viewer", password: "a long and unusual demo passphrase 8" });
    await expect(admin.addError.first()).toBeVisible();
    await expect(admin.addedNotice).toHaveCount(0);
    await admin.add({ name: person, email, role: "viewer", password: "a long and unusual demo passphrase 8" });
    await expect(admin.addedNotice).toBeVisible();
    await expect(admin.addError).toHaveCount(0);
    await expect(admin.row(email)).toBeVisible();

    // Disable looks like the button it is, as Re-enable does.
    await admin.expectLooksLikeButton(admin.disableButton(email));

    // A role change asks first, then says it happened.
    await admin.pickRole(email, person, "support");
    await admin.confirm(`Change ${person}'s role to Support?`, "Change role");
    await expect(admin.changeDone).toHaveText(`${person}'s role is now Support.`);
    await expect(admin.roleOf(email, person)).toHaveValue("support");

    // So does a disable; then Re-enable is offered, drawn as a button too.
    await admin.disable(email);
    await admin.confirm(`Disable ${person}'s account?`, "Disable account");
    await expect(admin.changeDone).toHaveText(`${person}'s account is disabled; they are signed out and their tokens stop working.`);
    await expect(admin.row(email).getByText("disabled", { exact: true })).toBeVisible();
    await admin.expectLooksLikeButton(admin.reenableButton(email));
    await admin.reenableButton(email).click();
    await expect(admin.changeDone).toHaveText(`${person}'s account is enabled again.`);
    await expect(admin.row(email).getByText("active", { exact: true })).toBeVisible();
    await admin.expectAccessible();
  });
});

test.describe("new build form", () => {
  test("one sidebar entry is current, nothing offered in the slots until a board is picked and then that board's versions, slots are removed by a button, switching board clears the picked versions and range, and the bank is sized against each revision before creating", async ({ page }) => {
    test.setTimeout(120_000);
    await signInPage(page, ACCOUNTS.engineer);
    // A second board model, with no coolers (so no profile versions) yet, to switch to.
    const otherBoard = `Bench board ${Date.now()}`;
    const serialPrefix = `B${Math.random().toString(36).slice(2, 8).toUpperCase().padEnd(6, "0")}`;
    const made = await page.request.post("/api/v1/board-models", { data: { name: otherBoard, serialPrefix, description: "Second board for the new-build form's switch check." } });
    expect(made.status(), await made.text()).toBe(201);
    const form = await new NewBuildForm(page).goto();
    await expect(form.currentNavEntries).toHaveCount(1);
    await expect(form.currentNavEntries).toHaveText("New build");
    const pipeline = await new BuildsPipeline(page).goto();
    await expect(pipeline.currentNavEntries).toHaveCount(1);
    await expect(pipeline.currentNavEntries).toHaveText("Builds");
    await form.goto();

    // Before a board model is picked the slot lists offer nothing and say to pick one first, also
    // once the form's options have loaded (the board list is filled from the same answer).
    await expect(form.boardModelOption("TC-1 cooler controller")).toBeAttached();
    await expect(form.pickBoardFirstHint).toBeVisible();
    await expect(form.slots).toHaveCount(2);
    await expect(form.offeredVersions(1)).toHaveCount(0);
    await expect(form.offeredVersions(2)).toHaveCount(0);

    // Once the board is picked the lists offer that board's versions, the ones the API gives for
    // it, the hint asking to pick a board goes away, and the list still shows the picked board
    // (not the first one, which other tests' board models may be).
    const version = `${100 + Math.floor(Math.random() * 150)}.${Math.floor(Math.random() * 256)}.${Math.floor(Math.random() * 256)}`;
    await form.describe({ board: "TC-1 cooler controller", version, revisions: ">=1.0.0 <3.0.0" });
    await expect(form.slot(1).locator("option", { hasText: "Tarn 240 · Quiet office" }).first()).toBeAttached();
    await expect(form.slotsHint).toHaveCount(0);
    await expect(form.shownBoardModel).toHaveText("TC-1 cooler controller");
    const answer = await page.request.get(`/api/v1/builds/options?boardModelId=${await form.boardModel.inputValue()}`);
    expect(answer.status()).toBe(200);
    const forBoard = ((await answer.json()) as { candidates: { id: string }[] }).candidates.map((c) => c.id).sort();
    expect(forBoard.length).toBeGreaterThan(0);
    expect(await form.offeredVersionIds(1)).toEqual(forBoard);
    expect(await form.offeredVersionIds(2)).toEqual(forBoard);

    // Slots: Remove the last slot is a button, and removes one; the last one stays.
    await expect(form.slots).toHaveCount(2);
    await form.expectLooksLikeButton(form.removeSlot);
    await form.removeSlot.click();
    await expect(form.slots).toHaveCount(1);
    await expect(form.removeSlot).toBeDisabled();
    await form.addSlot.click();
    await expect(form.slots).toHaveCount(2);

    // Switching board model after picking a version and a range: the version was for the old
    // board's coolers and the range over its revisions, so both are gone, in the lists and in what
    // a submit sends, which the form then says is still needed instead of sending old ids.
    await form.pickSlot(1, "Tarn 240 · Quiet office");
    await expect(form.bankFit).toContainText("The bank takes");
    await form.boardModel.selectOption({ label: otherBoard });
    await expect(form.shownBoardModel).toHaveText(otherBoard);
    await expect(form.slotsHint).toHaveText(/^No profile version is published for this board model's coolers yet/);
    await expect(form.slot(1)).toHaveValue("");
    await expect(form.slot(2)).toHaveValue("");
    await expect(form.revisionRange).toHaveValue("");
    await expect(form.buildVersion).toHaveValue(version);
    await form.createButton.click();
    await expect(form.fieldError("slot-0")).toHaveText(/^(Pick a profile version\.|Put at least one profile version in a slot\.)$/);
    await expect(form.fieldError("revisionRange")).toHaveText(/^Give the board revisions/);
    await expect(form.alert(/another board model|does not exist|does not fit/)).toHaveCount(0);
    expect(new URL(page.url()).pathname).toBe("/builds/new");

    // Back to the first board: its versions are offered again, none is picked, and the bank check
    // counts no slot (it counted the old pick while the lists showed none).
    await form.boardModel.selectOption({ label: "TC-1 cooler controller" });
    await expect(form.slotOption(1, "Tarn 240 · Quiet office")).toBeAttached();
    await expect(form.slot(1)).toHaveValue("");
    await expect(form.slot(2)).toHaveValue("");
    await expect(form.fieldError("slot-0")).toHaveCount(0);
    await expect(form.bankFit).toContainText("Pick profile versions to see the bank's size.");
    await form.revisionRange.fill(">=1.0.0 <3.0.0");

    // One version picked, slot 2 left "(empty)": the form finds nothing missing in the slots and
    // goes on to ask for the firmware image (an empty slot is not part of the bank, not an error).
    await form.pickSlot(1, "Tarn 240 · Quiet office");
    await form.createButton.click();
    await expect(form.alert("Choose the firmware image (.bin or .hex).")).toBeVisible();
    await expect(form.fieldError("slot-0")).toHaveCount(0);
    await expect(form.fieldError("slot-1")).toHaveCount(0);

    // The bank the two slots make, against each revision's profile memory and slot count (demo revisions).
    await form.pickSlot(1, "Tarn 240 · Quiet office");
    await form.pickSlot(2, "Tarn 360 · Hush");
    await expect(form.bankFit).toContainText(/The bank takes [\d,]+ bytes in 2 slots\./);
    const stated = Number((await form.bankFit.textContent())!.match(/The bank takes ([\d,]+) bytes/)![1]!.replace(/,/g, ""));
    for (const r of DEMO_REVISIONS) {
      const row = form.bankFitRow(r.revision);
      await expect(row).toContainText(`${r.memoryBytes.toLocaleString("en")} B`);
      const fits = stated <= r.memoryBytes && 2 <= r.slotCount;
      await expect(row.getByRole("cell").last()).toHaveText(fits ? /^yes, [\d,]+ B spare$/ : /^no: /);
    }

    // What the form said before creating is the size of the bank the server then encodes.
    await form.attachFirmware("tc1-fw.bin", Buffer.alloc(4096, 0xa5));
    const path = await form.create();
    const bank = await page.request.get(`/api/v1${path}/bank?format=bin`);
    expect(bank.status()).toBe(200);
    expect((await bank.body()).length).toBe(stated);
  });
});

test.describe("dashboard", () => {
  test("recent activity reads as sentences naming the person, the profile and its version, not action codes", async ({ page }) => {
    await signInPage(page, ACCOUNTS.engineer);
    const list = await new ProfilesList(page).goto();
    const name = `Evening ${Date.now()}`;
    const id = await list.start({ cooler: "Tarn 360", name });
    const editor = new ProfileEditor(page);
    await expect(editor.chart).toBeVisible();
    await editor.expectSuggested("1.0.0");
    await editor.publish({ changelog: "First release for the dashboard check." });
    await expect(page.getByText(/Published 1\.0\.0/)).toBeVisible();

    const dashboard = await new DashboardPage(page).goto();
    const entry = dashboard.activityEntry(`Teodor Quist published ${name} 1.0.0`);
    await expect(entry).toHaveCount(1);
    await expect(entry.getByRole("link")).toHaveAttribute("href", `/profiles/${id}#version-1.0.0`);
    const sentences = await dashboard.activitySentences.allTextContents();
    expect(sentences.length).toBeGreaterThan(1);
    for (const s of sentences) {
      // No stored action code ("profile_version.publish", "lot.import"), no id or id prefix.
      expect(s).not.toMatch(/\b(?:profile_version|profile|build|lot|user|token|upload|board_revision|board_model|component|cooler_model)\.[a-z_]+/);
      expect(s).not.toMatch(/\b[0-9a-f]{8}\b/);
    }
  });
});
