import type { Locator } from "@playwright/test";
import { Screen } from "./screen";

/** /lookup: serial lookup, the tach converter and memory-dump identification. */
export class LookupPage extends Screen {
  async goto(serial?: string): Promise<this> {
    await this.page.goto(serial ? `/lookup?serial=${encodeURIComponent(serial)}` : "/lookup");
    return this;
  }

  async lookUp(serial: string): Promise<void> {
    await this.page.getByLabel("Serial number").fill(serial);
    await this.button("Look up").click();
  }

  get recentLookups(): Locator {
    return this.page.getByRole("navigation", { name: "Recent lookups" });
  }

  async identify(file: { name: string; mimeType: string; buffer: Buffer }): Promise<Locator> {
    await this.page.getByLabel("Dump file (.bin or .hex)").setInputFiles(file);
    await this.button("Identify").click();
    return this.dumpResult;
  }

  get dumpResult(): Locator {
    return this.page.getByTestId("dump-result");
  }
}

/** /lots: the paged lot list, the record form and the CSV import. */
export class LotsPage extends Screen {
  async goto(): Promise<this> {
    await this.page.goto("/lots");
    return this;
  }

  get table(): Locator {
    return this.page.getByRole("table", { name: "Production lots" });
  }

  lot(code: string): Locator {
    return this.page.getByRole("cell", { name: code, exact: true });
  }

  get recordForm(): Locator {
    return this.page.getByRole("heading", { name: "Record a lot" });
  }

  get importForm(): Locator {
    return this.page.getByRole("heading", { name: "Import lots from CSV" });
  }

  async previewCsv(name: string, csv: string): Promise<void> {
    await this.page.getByLabel("CSV file").setInputFiles({ name, mimeType: "text/csv", buffer: Buffer.from(csv) });
    await this.button("Preview").click();
  }

  get importProblems(): Locator {
    return this.page.getByRole("table", { name: "Problems by row" });
  }
}
