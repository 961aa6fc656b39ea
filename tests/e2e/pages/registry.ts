import type { Locator } from "@playwright/test";
import { Screen } from "./screen";

/** /cooler-models: the list with its edit buttons and the add/edit form. */
export class CoolerModelsList extends Screen {
  async goto(filter: { q?: string } = {}): Promise<this> {
    await this.page.goto(filter.q ? `/cooler-models?q=${encodeURIComponent(filter.q)}` : "/cooler-models");
    return this;
  }

  get table(): Locator {
    return this.page.getByRole("table", { name: "Cooler models" });
  }

  row(name: string | RegExp): Locator {
    return this.table.getByRole("row", { name: typeof name === "string" ? new RegExp(name) : name });
  }

  /** Opens the edit form of a cooler model; answers the form. */
  async edit(name: string): Promise<Locator> {
    await this.pressUntilShown(this.button(`Edit ${name}`), this.editForm);
    return this.editForm;
  }

  get editForm(): Locator {
    return this.page.locator("form").filter({ has: this.page.getByRole("button", { name: "Save changes" }) });
  }
}

/** /components: fans and pumps. */
export class ComponentsList extends Screen {
  async goto(filter: { q?: string } = {}): Promise<this> {
    await this.page.goto(filter.q ? `/components?q=${encodeURIComponent(filter.q)}` : "/components");
    return this;
  }

  get table(): Locator {
    return this.page.getByRole("table", { name: "Components" });
  }

  row(name: string): Locator {
    return this.table.getByRole("row", { name: new RegExp(name) });
  }

  /** The "Add a fan or pump" form. */
  get addForm(): Locator {
    return this.page.locator("form").filter({ has: this.page.getByRole("button", { name: "Add component" }) });
  }

  /** Fills the add form; `soundTable` is the text typed into the measured sound table, one "RPM dB(A)" per line. */
  async fillComponent(c: { name: string; kind: "fan" | "pump"; minDutyPct: number; rpmAtMinDuty: number; maxRpm: number; refSoundDbA: number; refRpm: number; soundTable?: string; stopsAtZeroDuty?: boolean }): Promise<void> {
    const f = this.addForm;
    await f.getByLabel("Name").fill(c.name);
    await f.getByLabel("Kind").selectOption(c.kind);
    await f.getByLabel("Minimum duty (%)").fill(String(c.minDutyPct));
    await f.getByLabel("RPM at minimum duty").fill(String(c.rpmAtMinDuty));
    await f.getByLabel("Maximum RPM").fill(String(c.maxRpm));
    await f.getByLabel("Reference sound level, dB(A) at 1 m").fill(String(c.refSoundDbA));
    await f.getByLabel("Reference RPM").fill(String(c.refRpm));
    await f.getByLabel("Measured sound table (optional)").fill(c.soundTable ?? "");
    await f.getByLabel(/Stops at 0 % duty/).setChecked(c.stopsAtZeroDuty ?? false);
  }
}

/** /boards: board models with their revisions. */
export class BoardsPage extends Screen {
  async goto(): Promise<this> {
    await this.page.goto("/boards");
    return this;
  }

  revisionsOf(boardName: string): Locator {
    return this.page.getByRole("table", { name: `Revisions of ${boardName}` });
  }

  async openRevision(revision: string): Promise<BoardRevisionPage> {
    await this.page.getByRole("link", { name: revision, exact: true }).click();
    return new BoardRevisionPage(this.page);
  }
}

/** /board-revisions/{id}: limits and which published versions fit. */
export class BoardRevisionPage extends Screen {}
