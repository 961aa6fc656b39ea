import { expect, type Locator } from "@playwright/test";
import { STAGE_ORDER, type Stage } from "@/lib/release/stages";
import { Screen } from "./screen";

/** /builds: the pipeline, one column per stage. */
export class BuildsPipeline extends Screen {
  static readonly stages = STAGE_ORDER;

  async goto(): Promise<this> {
    await this.page.goto("/builds");
    return this;
  }

  column(stage: Stage): Locator {
    return this.page.getByTestId(`pipeline-${stage}`);
  }

  card(version: string): Locator {
    return this.page.getByRole("link").filter({ hasText: version });
  }

  get newBuildLink(): Locator {
    return this.page.getByRole("link", { name: "New build" });
  }
}

/** /builds/new: board, version, revision range, slots and the firmware image. */
export class NewBuildForm extends Screen {
  async goto(): Promise<this> {
    await this.page.goto("/builds/new");
    return this;
  }

  async describe({ board, version, revisions }: { board: string; version: string; revisions: string }): Promise<void> {
    await this.boardModel.selectOption({ label: board });
    await this.buildVersion.fill(version);
    await this.revisionRange.fill(revisions);
  }

  get boardModel(): Locator {
    return this.page.getByLabel("Board model");
  }

  get buildVersion(): Locator {
    return this.page.getByLabel("Build version");
  }

  get revisionRange(): Locator {
    return this.page.getByLabel("Board revisions");
  }

  /** The message a field of this form shows under it when what it holds is refused (field ids: `revisionRange`, `slot-0`, …). */
  fieldError(id: string): Locator {
    return this.page.locator(`[id="${id}-error"]`);
  }

  /** The board model list's entry `name`: there once the form's options have loaded. */
  boardModelOption(name: string): Locator {
    return this.boardModel.locator("option", { hasText: name });
  }

  /** The board model the list shows as picked. */
  get shownBoardModel(): Locator {
    return this.boardModel.locator("option:checked");
  }

  /** The profile versions slot `n` offers: its options that pick something (not the prompt or "(empty)"). */
  offeredVersions(n: number): Locator {
    return this.slot(n).locator('option:not([value=""])');
  }

  /** The ids of the profile versions slot `n` offers, sorted. */
  async offeredVersionIds(n: number): Promise<string[]> {
    return (await this.offeredVersions(n).evaluateAll((options) => options.map((o) => (o as HTMLOptionElement).value))).sort();
  }

  /** The note under Slots that asks for a board model before any version is offered. */
  get pickBoardFirstHint(): Locator {
    return this.page.getByText("Pick a board model to see its profile versions.", { exact: true });
  }

  /** The option of slot `n` whose text contains `text`, once the list is filled for the chosen board. */
  slotOption(n: number, text: string): Locator {
    return this.slot(n).locator("option", { hasText: text }).first();
  }

  slot(n: number): Locator {
    return this.page.getByLabel(`Slot ${n}`, { exact: true });
  }

  /** Picks the first profile version whose option text contains `text` (the list is filled once the board is chosen). */
  async pickSlot(n: number, text: string): Promise<void> {
    const select = this.slot(n);
    const option = this.slotOption(n, text);
    await expect(option).toBeAttached();
    const value = await option.getAttribute("value");
    expect(value, `a profile version for slot ${n} containing "${text}"`).toBeTruthy();
    await select.selectOption(value ?? "");
  }

  /** The note under Slots that says why the lists are empty. */
  get slotsHint(): Locator {
    return this.page.getByText(/^(Pick a board model to see its profile versions\.|No profile version is published for this board model's coolers yet)/);
  }

  /** The slot lists shown now (Slot 1, Slot 2, …). */
  get slots(): Locator {
    return this.page.getByRole("group", { name: "Slots (published profile versions)" }).getByRole("combobox");
  }

  get addSlot(): Locator {
    return this.button("Add a slot");
  }

  get removeSlot(): Locator {
    return this.button("Remove the last slot");
  }

  /** The bank-size table: the chosen slots' bank against each board revision. */
  get bankFit(): Locator {
    return this.page.getByTestId("bank-fit");
  }

  bankFitRow(revision: string): Locator {
    return this.bankFit.getByRole("row").filter({ has: this.page.getByRole("cell", { name: revision, exact: true }) });
  }

  async attachFirmware(name: string, bytes: Buffer): Promise<void> {
    await this.chooseFile("Firmware image", { name, mimeType: "application/octet-stream", buffer: bytes });
  }

  get createButton(): Locator {
    return this.button("Create build");
  }

  /** Submits and waits for the new build's page; answers its path. */
  async create(): Promise<string> {
    await this.createButton.click();
    await this.page.waitForURL(/\/builds\/[0-9a-f-]{36}$/);
    return new URL(this.page.url()).pathname;
  }
}

/** /builds/{id}: the bank, slots, evidence, reviews, stage actions and timeline. */
export class BuildDetail extends Screen {
  async goto(path: string): Promise<this> {
    await this.page.goto(path);
    return this;
  }

  get bankSha256(): Locator {
    return this.page.getByTestId("bank-sha256");
  }

  get timeline(): Locator {
    return this.page.getByTestId("timeline");
  }

  get reviews(): Locator {
    return this.page.getByRole("list", { name: "Reviews" });
  }

  /** Reviews listed as counting toward the approvals. */
  get countingReviews(): Locator {
    return this.reviews.getByText("Counts toward the approvals.");
  }

  /** Why this person may not review the build, shown instead of the review form. */
  get reviewRefusal(): Locator {
    return this.page.getByTestId("review-refusal");
  }

  /** The caution shown beside the estimated figures. */
  get estimateCaution(): Locator {
    return this.page.getByText("Estimates, not measurements");
  }

  /** The next stage's checklist ("lab validation", "pilot run", …). */
  checklist(stage: string): Locator {
    return this.page.getByRole("list", { name: `Checklist for ${stage}` });
  }

  /** One requirement of a checklist; its data-state says "met" or "unmet". */
  requirement(stage: string, text: string): Locator {
    return this.checklist(stage).getByRole("listitem").filter({ hasText: text });
  }

  /** The alert a withdrawn build shows with its reason. */
  get withdrawnNotice(): Locator {
    return this.alert("This build was withdrawn");
  }

  /** The factory release confirmation for the build called `title`. */
  releaseDialog(title: string): Locator {
    return this.dialog(`Release build ${title} to the factory?`);
  }

  /** The withdraw confirmation for the build called `title`. */
  withdrawDialog(title: string): Locator {
    return this.dialog(`Withdraw build ${title}?`);
  }

  get withdrawReason(): Locator {
    return this.page.getByLabel("Reason for withdrawing");
  }

  async expectStage(label: string): Promise<void> {
    await expect(this.heading).toContainText(label);
  }

  /** Presses a stage button ("Ask for review", "Promote to lab validation", …) and waits for the heading to show the new stage. */
  async move(button: string, stageLabel: string): Promise<void> {
    await this.button(button).click();
    await this.expectStage(stageLabel);
  }

  async approve(comment: string): Promise<void> {
    await this.page.getByLabel("Comment").fill(comment);
    await this.button("Approve").click();
  }

  async attachLabReport(name: string, pdf: Buffer): Promise<void> {
    await this.page.getByLabel("Lab report (PDF)").setInputFiles({ name, mimeType: "application/pdf", buffer: pdf });
  }

  async attachMeasurements(name: string, csv: Buffer): Promise<void> {
    await this.page.getByLabel("Measurements (CSV)").setInputFiles({ name, mimeType: "text/csv", buffer: csv });
  }

  get soundPlot(): Locator {
    return this.page.getByTestId("sound-plot");
  }

  /** Opens the factory release dialog, writes the release notes in it and confirms. */
  async releaseToFactory(notes: string): Promise<void> {
    await this.button("Release to the factory…").click();
    const dialog = this.dialog(/^Release build .* to the factory\?$/);
    await dialog.getByLabel("Release notes").fill(notes);
    await dialog.getByRole("button", { name: "Release to the factory", exact: true }).click();
    await this.expectStage("Factory release");
  }

  /** Opens the withdraw dialog, gives the reason in it and confirms. */
  async withdraw(reason: string): Promise<void> {
    await this.button("Withdraw build…").click();
    const dialog = this.dialog(/^Withdraw build .*\?$/);
    await dialog.getByLabel("Reason for withdrawing").fill(reason);
    await dialog.getByRole("button", { name: "Withdraw build", exact: true }).click();
    await this.expectStage("Withdrawn");
  }
}
