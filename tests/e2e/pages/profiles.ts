import { expect, type Locator } from "@playwright/test";
import { Screen } from "./screen";

/** /profiles: the filtered, paged list and the form that starts a profile. */
export class ProfilesList extends Screen {
  async goto(filter: { q?: string } = {}): Promise<this> {
    await this.page.goto(filter.q ? `/profiles?q=${encodeURIComponent(filter.q)}` : "/profiles");
    return this;
  }

  get table(): Locator {
    return this.page.getByRole("table", { name: "Profiles" });
  }

  link(name: string): Locator {
    return this.page.getByRole("link", { name, exact: true });
  }

  /** Starts a profile and waits for its editor; answers the new profile's id. */
  async start({ cooler, name }: { cooler: string; name: string }): Promise<string> {
    await this.page.getByLabel("Cooler model", { exact: true }).last().selectOption({ label: cooler });
    await this.page.getByLabel("Profile name").fill(name);
    await this.button("Create and open the editor").click();
    await this.page.waitForURL(/\/profiles\/[0-9a-f-]{36}$/);
    return this.page.url().split("/").pop()!;
  }
}

/** /profiles/{id}: the JSON editor with its problems, plot, publish form and version history. */
export class ProfileEditor extends Screen {
  async goto(id: string): Promise<this> {
    await this.page.goto(`/profiles/${id}`);
    return this;
  }

  get editor(): Locator {
    return this.page.locator(".monaco-editor");
  }

  get chart(): Locator {
    return this.page.getByTestId("curve-chart");
  }

  get coolerName(): Locator {
    return this.page.getByTestId("cooler-name");
  }

  get suggestion(): Locator {
    return this.page.getByTestId("suggestion");
  }

  get saveState(): Locator {
    return this.page.getByTestId("save-state");
  }

  /** The operating point's listener distance input. */
  get listenerDistance(): Locator {
    return this.page.getByLabel("Listener distance (m)");
  }

  get operatingReadout(): Locator {
    return this.page.getByTestId("operating-readout");
  }

  get coolerPicker(): Locator {
    return this.page.getByLabel("Evaluate on cooler");
  }

  get otherCoolerNote(): Locator {
    return this.page.getByTestId("evaluating-other-cooler");
  }

  /** The publish form's board revision range. */
  get rangeField(): Locator {
    return this.page.getByLabel("Board revision range");
  }

  /** The memory gauge's verdict on the typed range. */
  get rangeVerdict(): Locator {
    return this.page.getByTestId("range-fit");
  }

  /** The memory gauge's row of one board revision. */
  memoryRow(revision: string): Locator {
    return this.page.getByTestId(`memory-${revision}`);
  }

  problem(text: RegExp): Locator {
    return this.page.getByTestId("problems").getByRole("button", { name: text });
  }

  /** Replaces the whole editor text through the editor's handle (typing a whole document is slow and not the point). */
  async setText(text: string): Promise<void> {
    await this.page.waitForFunction(() => Boolean(window.__loopkeeperEditor));
    await this.page.evaluate((t) => window.__loopkeeperEditor!.setText(t), text);
  }

  async publish({ version, changelog }: { version?: string; changelog: string }): Promise<void> {
    if (version !== undefined) await this.page.getByLabel("Version", { exact: true }).fill(version);
    await this.page.getByLabel("Changelog").fill(changelog);
    await this.button("Publish version").click();
  }

  async expectSuggested(version: string): Promise<void> {
    await expect(this.suggestion).toContainText(version);
    await expect(this.page.getByLabel("Version", { exact: true })).toHaveValue(version);
  }
}

/** /profiles/{id}/compare: two versions' curves and text side by side. */
export class ProfileCompare extends Screen {
  get chart(): Locator {
    return this.page.getByTestId("compare-chart");
  }

  get diff(): Locator {
    return this.page.getByTestId("diff-view").locator(".monaco-diff-editor");
  }
}
