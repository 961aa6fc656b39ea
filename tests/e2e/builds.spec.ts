import { expect, test, type Browser, type Page } from "@playwright/test";
import { coolerNoise } from "@/lib/engine";
import { toHardwareContext } from "@/lib/registry/hardware-context";
import { MEASUREMENT_HEADER } from "@/lib/release/measurements";
import { DEMO_COMPONENTS, DEMO_REVISIONS } from "@/db/seed/hardware";
import { signInPage } from "./support/accounts";
import { expectAccessible } from "./support/a11y";

/** A one-page PDF made here: header, one object per part, cross-reference table, trailer. */
function tinyPdf(): Buffer {
  const objects = ["<< /Type /Catalog /Pages 2 0 R >>", "<< /Type /Pages /Kids [3 0 R] /Count 1 >>", "<< /Type /Page /Parent 2 0 R /MediaBox [0 0 200 200] >>"];
  let out = "%PDF-1.4\n";
  const offsets = objects.map((o, i) => {
    const at = out.length;
    out += `${i + 1} 0 obj\n${o}\nendobj\n`;
    return at;
  });
  const xref = out.length;
  out += `xref\n0 ${objects.length + 1}\n0000000000 65535 f \n${offsets.map((o) => `${String(o).padStart(10, "0")} 00000 n \n`).join("")}trailer\n<< /Size ${objects.length + 1} /Root 1 0 R >>\nstartxref\n${xref}\n%%EOF\n`;
  return Buffer.from(out, "latin1");
}

/** Lab figures for the Tarn 240 (two PWM fans, the pump): the engine's estimate ±1 dB at each speed. */
function measurementsCsv(): Buffer {
  const fan = DEMO_COMPONENTS.find((c) => c.name === "Fellwind 120 PWM fan")!;
  const pump = DEMO_COMPONENTS.find((c) => c.name === "Brook D3 pump")!;
  const hw = toHardwareContext({ cooler: { name: "Tarn 240", fanCount: 2, radiatorKPerWAtMinFan: 0.11, radiatorKPerWAtMaxFan: 0.045 }, fan, pump, revision: DEMO_REVISIONS[0]! });
  const rows = [[32, 1500, 800, 0.6], [42, 2000, 1200, -0.9], [52, 2600, 1700, 1.0]] as const;
  return Buffer.from([MEASUREMENT_HEADER, ...rows.map(([t, p, f, d]) => `${t},${p},${f},${(coolerNoise(hw, f, p).totalDbA1m + d).toFixed(1)}`)].join("\n") + "\n");
}

async function as(browser: Browser, email: string, url: string): Promise<Page> {
  const ctx = await browser.newContext();
  const page = await ctx.newPage();
  await signInPage(page, email);
  await page.goto(url);
  return page;
}

test("a build goes from draft to the factory and is withdrawn, with reviews, lab evidence and mail", async ({ browser }) => {
  test.setTimeout(180_000);
  const version = `${100 + Math.floor(Math.random() * 150)}.${Math.floor(Math.random() * 256)}.${Math.floor(Math.random() * 256)}`;
  const title = `TC-1 cooler controller ${version}`;

  // The engineer creates the build and asks for review.
  const engineer = await as(browser, "engineer@tarnwell.example", "/builds/new");
  await engineer.getByLabel("Board model").selectOption({ label: "TC-1 cooler controller" });
  await engineer.getByLabel("Build version").fill(version);
  await engineer.getByLabel("Board revisions").fill(">=1.0.0 <3.0.0");
  const slot1 = engineer.getByLabel("Slot 1", { exact: true });
  await expect(slot1.locator("option", { hasText: "Tarn 240 · Quiet office" }).first()).toBeAttached();
  const pick = async (slot: string, text: string) => {
    const select = engineer.getByLabel(slot, { exact: true });
    const value = await select.locator("option", { hasText: text }).first().getAttribute("value");
    expect(value).toBeTruthy();
    await select.selectOption(value ?? "");
  };
  // Demo profiles authored by engineer@, so engineer2@ and engineer3@ are independent reviewers.
  await pick("Slot 1", "Tarn 240 · Quiet office");
  await pick("Slot 2", "Tarn 360 · Hush");
  await expectAccessible(engineer);
  await engineer.getByLabel("Firmware image").setInputFiles({ name: "tc1-fw.bin", mimeType: "application/octet-stream", buffer: Buffer.alloc(4096, 0xa5) });
  await engineer.getByRole("button", { name: "Create build" }).click();
  await engineer.waitForURL(/\/builds\/[0-9a-f-]{36}$/);
  const buildUrl = new URL(engineer.url()).pathname;
  await expect(engineer.getByRole("heading", { level: 1 })).toContainText(title);
  await expect(engineer.getByTestId("bank-sha256")).toHaveText(/^[0-9a-f]{64}$/);
  await expect(engineer.getByText("Estimates, not measurements")).toBeVisible();
  await engineer.getByRole("button", { name: "Ask for review" }).click();
  await expect(engineer.getByRole("heading", { level: 1 })).toContainText("In review");
  // The author has no approve button: the server would refuse it anyway, and says why.
  await expect(engineer.getByRole("button", { name: "Approve" })).toHaveCount(0);
  await expect(engineer.getByTestId("review-refusal")).toContainText("You created this build");

  // The release manager watches the checklist of the next stage fill in.
  const release = await as(browser, "release@tarnwell.example", buildUrl);
  const checklist = (stage: string) => release.getByRole("list", { name: `Checklist for ${stage}` });
  const line = (stage: string, text: string) => checklist(stage).getByRole("listitem").filter({ hasText: text });
  const promote = release.getByRole("button", { name: "Promote to lab validation" });
  await expect(line("lab validation", "Approvals 0 of 2")).toHaveAttribute("data-state", "unmet");
  await expect(promote).toBeDisabled();

  // Two other engineers approve; each approval is listed as counting.
  for (const [i, email] of ["engineer2@tarnwell.example", "engineer3@tarnwell.example"].entries()) {
    const reviewer = await as(browser, email, buildUrl);
    await reviewer.getByLabel("Comment").fill("Curves and bank size look right.");
    await reviewer.getByRole("button", { name: "Approve" }).click();
    await expect(reviewer.getByRole("list", { name: "Reviews" }).getByText("Counts toward the approvals.")).toHaveCount(i + 1);
    // A second approval would be refused: the form now changes the reviewer's verdict instead.
    await expect(reviewer.getByText("You approved; sending again changes your verdict.")).toBeVisible();
    await reviewer.context().close();
    await release.reload();
    await expect(line("lab validation", `Approvals ${i + 1} of 2`)).toHaveAttribute("data-state", i === 0 ? "unmet" : "met");
    await (i === 0 ? expect(promote).toBeDisabled() : expect(promote).toBeEnabled());
  }
  await promote.click();
  await expect(release.getByRole("heading", { level: 1 })).toContainText("Lab validation");

  // Lab evidence arrives; the pilot checklist follows it.
  const toPilot = release.getByRole("button", { name: "Promote to pilot run" });
  await expect(line("pilot run", "Lab report attached")).toHaveAttribute("data-state", "unmet");
  await expect(line("pilot run", "Measured sound within tolerance")).toHaveAttribute("data-state", "unmet");
  await expect(toPilot).toBeDisabled();
  await release.getByLabel("Lab report (PDF)").setInputFiles({ name: "lab-report.pdf", mimeType: "application/pdf", buffer: tinyPdf() });
  await expect(release.getByRole("link", { name: "lab-report.pdf" })).toBeVisible();
  await expect(line("pilot run", "Lab report attached")).toHaveAttribute("data-state", "met");
  await expect(toPilot).toBeDisabled();
  await release.getByLabel("Measurements (CSV)").setInputFiles({ name: "measurements.csv", mimeType: "text/csv", buffer: measurementsCsv() });
  await expect(release.getByTestId("sound-plot")).toBeVisible();
  // Measured, corrected for the room's background, and estimated.
  await expect(release.getByTestId("sound-plot").locator(".recharts-line")).toHaveCount(3);
  await expect(release.getByText("no compared point is louder than the estimate by more than that.")).toBeVisible();
  await expect(line("pilot run", "Measurement CSV attached")).toHaveAttribute("data-state", "met");
  await expect(line("pilot run", "Measured sound within tolerance")).toHaveAttribute("data-state", "met");
  await expectAccessible(release);
  await toPilot.click();
  await expect(release.getByRole("heading", { level: 1 })).toContainText("Pilot run");

  // Release to the factory happens only after confirming in a dialog that names the build.
  await release.getByRole("button", { name: "Release to the factory…" }).click();
  const dialog = release.getByRole("dialog", { name: `Release build ${title} to the factory?` });
  await expect(dialog).toBeVisible();
  await expect(dialog).toContainText("This cannot be undone.");
  const confirmRelease = dialog.getByRole("button", { name: "Release to the factory" });
  await expect(confirmRelease).toBeDisabled();
  await expectAccessible(release);
  // Cancelling changes nothing.
  await dialog.getByRole("button", { name: "Cancel" }).click();
  await expect(dialog).toBeHidden();
  await expect(release.getByRole("heading", { level: 1 })).toContainText("Pilot run");
  await release.getByRole("button", { name: "Release to the factory…" }).click();
  await dialog.getByLabel("Release notes").fill("First factory run of the e2e build.");
  await confirmRelease.click();
  await expect(dialog).toBeHidden();
  await expect(release.getByRole("heading", { level: 1 })).toContainText("Factory release");

  // The stage mails arrive in the local mailbox.
  const admin = await as(browser, "admin@tarnwell.example", "/admin/mailbox");
  for (const subject of [
    `Build ${title} is waiting for your review`,
    `Your build ${title} was approved`,
    `Build ${title} has entered lab validation`,
    `Build ${title} has entered the pilot run`,
    `Build ${title} was released to the factory`,
  ]) {
    await expect(admin.getByText(subject).first()).toBeVisible({ timeout: 30_000 });
  }
  await expectAccessible(admin);

  // Then it turns out bad and is withdrawn with a reason, behind its own confirmation.
  await expect(release.getByLabel("Reason for withdrawing")).toHaveCount(0);
  await release.getByRole("button", { name: "Withdraw build…" }).click();
  const withdraw = release.getByRole("dialog", { name: `Withdraw build ${title}?` });
  await withdraw.getByLabel("Reason for withdrawing").fill("Fan ramp too aggressive on returned units.");
  await withdraw.getByRole("button", { name: "Withdraw build" }).click();
  await expect(release.getByRole("heading", { level: 1 })).toContainText("Withdrawn");
  await expect(release.getByRole("alert").filter({ hasText: "This build was withdrawn" })).toContainText("Fan ramp too aggressive");
  await expect(admin.getByText(`Build ${title} was withdrawn`).first()).toBeVisible({ timeout: 30_000 });
  await expect(release.getByTestId("timeline")).toContainText("Withdrawn");
});

test("the pipeline shows builds in columns by stage", async ({ page }) => {
  await signInPage(page, "viewer@tarnwell.example");
  await page.goto("/builds");
  for (const stage of ["draft", "review", "validation", "pilot", "production", "withdrawn"]) {
    await expect(page.getByTestId(`pipeline-${stage}`).getByRole("link").first()).toBeVisible();
  }
  await expect(page.getByRole("link", { name: "New build" })).toHaveCount(0);
  await expectAccessible(page);
});
