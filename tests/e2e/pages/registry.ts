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
    await this.button(`Edit ${name}`).click();
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
