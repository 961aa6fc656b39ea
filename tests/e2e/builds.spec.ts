import { expect, test, type Browser } from "@playwright/test";
import { coolerNoise } from "@/lib/engine";
import { toHardwareContext } from "@/lib/registry/hardware-context";
import { MEASUREMENT_HEADER } from "@/lib/release/measurements";
import { DEMO_COMPONENTS, DEMO_REVISIONS } from "@/db/seed/hardware";
import { ACCOUNTS, signInPage } from "./support/accounts";
import { MailboxPage } from "./pages/admin";
import { BuildDetail, BuildsPipeline, NewBuildForm } from "./pages/builds";

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
  const hw = toHardwareContext({ cooler: { name: "Tarn 240", radiatorMm: 240, fanCount: 2, radiatorKPerWAtMinFan: 0.11, radiatorKPerWAtMaxFan: 0.045 }, fan, pump, revision: DEMO_REVISIONS[0]! });
  const rows = [[32, 1500, 800, 0.6], [42, 2000, 1200, -0.9], [52, 2600, 1700, 1.0]] as const;
  return Buffer.from([MEASUREMENT_HEADER, ...rows.map(([t, p, f, d]) => `${t},${p},${f},${(coolerNoise(hw, f, p).totalDbA1m + d).toFixed(1)}`)].join("\n") + "\n");
}

/** A fresh browser context signed in as `email`. */
async function signedIn(browser: Browser, email: string) {
  const page = await (await browser.newContext()).newPage();
  await signInPage(page, email);
  return page;
}

test("a build goes from draft to the factory and is withdrawn, with reviews, lab evidence and mail", async ({ browser }) => {
  test.setTimeout(180_000);
  const version = `${100 + Math.floor(Math.random() * 150)}.${Math.floor(Math.random() * 256)}.${Math.floor(Math.random() * 256)}`;
  const title = `TC-1 cooler controller ${version}`;

  // The engineer creates the build and asks for review.
  const form = await new NewBuildForm(await signedIn(browser, ACCOUNTS.engineer)).goto();
  await form.describe({ board: "TC-1 cooler controller", version, revisions: ">=1.0.0 <3.0.0" });
  await expect(form.slotOption(1, "Tarn 240 · Quiet office")).toBeAttached();
  // Demo profiles authored by engineer@, so engineer2@ and engineer3@ are independent reviewers.
  await form.pickSlot(1, "Tarn 240 · Quiet office");
  await form.pickSlot(2, "Tarn 360 · Hush");
  await form.expectAccessible();
  await form.attachFirmware("tc1-fw.bin", Buffer.alloc(4096, 0xa5));
  const buildUrl = await form.create();
  const authored = new BuildDetail(form.page);
  await expect(authored.heading).toContainText(title);
  await expect(authored.bankSha256).toHaveText(/^[0-9a-f]{64}$/);
  await expect(authored.estimateCaution).toBeVisible();
  await authored.move("Ask for review", "In review");
  // The author has no approve button: the server would refuse it anyway, and says why.
  await authored.expectNoButton("Approve");
  await expect(authored.reviewRefusal).toContainText("You created this build");

  // The release manager watches the checklist of the next stage fill in.
  const release = await new BuildDetail(await signedIn(browser, ACCOUNTS.release_manager)).goto(buildUrl);
  const promote = release.button("Promote to lab validation");
  await expect(release.requirement("lab validation", "Approvals 0 of 2")).toHaveAttribute("data-state", "unmet");
  await expect(promote).toBeDisabled();

  // Two other engineers approve; each approval is listed as counting.
  for (const [i, email] of ["engineer2@tarnwell.example", "engineer3@tarnwell.example"].entries()) {
    const reviewer = await new BuildDetail(await signedIn(browser, email)).goto(buildUrl);
    await reviewer.approve("Curves and bank size look right.");
    await expect(reviewer.countingReviews).toHaveCount(i + 1);
    // A second approval would be refused: the form now changes the reviewer's verdict instead.
    await expect(reviewer.page.getByText("You approved; sending again changes your verdict.")).toBeVisible();
    await reviewer.page.context().close();
    await release.page.reload();
    await expect(release.requirement("lab validation", `Approvals ${i + 1} of 2`)).toHaveAttribute("data-state", i === 0 ? "unmet" : "met");
    await (i === 0 ? expect(promote).toBeDisabled() : expect(promote).toBeEnabled());
  }
  await release.move("Promote to lab validation", "Lab validation");

  // Lab evidence arrives; the pilot checklist follows it.
  const toPilot = release.button("Promote to pilot run");
  await expect(release.requirement("pilot run", "Lab report attached")).toHaveAttribute("data-state", "unmet");
  await expect(release.requirement("pilot run", "Measured sound within tolerance")).toHaveAttribute("data-state", "unmet");
  await expect(toPilot).toBeDisabled();
  await release.attachLabReport("lab-report.pdf", tinyPdf());
  await expect(release.page.getByRole("link", { name: "lab-report.pdf" })).toBeVisible();
  await expect(release.requirement("pilot run", "Lab report attached")).toHaveAttribute("data-state", "met");
  await expect(toPilot).toBeDisabled();
  await release.attachMeasurements("measurements.csv", measurementsCsv());
  await expect(release.soundPlot).toBeVisible();
  // Measured, corrected for the room's background, and estimated.
  await expect(release.soundPlot.locator(".recharts-line")).toHaveCount(3);
  await expect(release.page.getByText("no compared point is louder than the estimate by more than that.")).toBeVisible();
  await expect(release.requirement("pilot run", "Measurement CSV attached")).toHaveAttribute("data-state", "met");
  await expect(release.requirement("pilot run", "Measured sound within tolerance")).toHaveAttribute("data-state", "met");
  await release.expectAccessible();
  await release.move("Promote to pilot run", "Pilot run");

  // Release to the factory happens only after confirming in a dialog that names the build.
  await release.button("Release to the factory…").click();
  const dialog = release.releaseDialog(title);
  await expect(dialog).toBeVisible();
  await expect(dialog).toContainText("This cannot be undone.");
  await expect(dialog.getByRole("button", { name: "Release to the factory", exact: true })).toBeDisabled();
  await release.expectAccessible();
  // Cancelling changes nothing.
  await dialog.getByRole("button", { name: "Cancel" }).click();
  await expect(dialog).toBeHidden();
  await release.expectStage("Pilot run");
  await release.releaseToFactory("First factory run of the e2e build.");
  await expect(dialog).toBeHidden();

  // The stage mails arrive in the local mailbox.
  const mailbox = await new MailboxPage(await signedIn(browser, ACCOUNTS.admin)).goto();
  for (const subject of [
    `Build ${title} is waiting for your review`,
    `Your build ${title} was approved`,
    `Build ${title} has entered lab validation`,
    `Build ${title} has entered the pilot run`,
    `Build ${title} was released to the factory`,
  ]) {
    await expect(mailbox.message(subject)).toBeVisible({ timeout: 30_000 });
  }
  await mailbox.expectAccessible();

  // Then it turns out bad and is withdrawn with a reason, behind its own confirmation.
  await expect(release.withdrawReason).toHaveCount(0);
  await release.withdraw("Fan ramp too aggressive on returned units.");
  await expect(release.withdrawnNotice).toContainText("Fan ramp too aggressive");
  await expect(mailbox.message(`Build ${title} was withdrawn`)).toBeVisible({ timeout: 30_000 });
  await expect(release.timeline).toContainText("Withdrawn");
});

test("the pipeline shows builds in columns by stage", async ({ page }) => {
  await signInPage(page, ACCOUNTS.viewer);
  const pipeline = await new BuildsPipeline(page).goto();
  for (const stage of BuildsPipeline.stages) {
    await expect(pipeline.column(stage).getByRole("link").first()).toBeVisible();
  }
  await expect(pipeline.newBuildLink).toHaveCount(0);
  await pipeline.expectAccessible();
});
