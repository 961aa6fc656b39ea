import type { Locator } from "@playwright/test";
import { Screen } from "./screen";

/** One state of the upload progress bar as the page drew it, in the order drawn. */
export interface ProgressSample {
  /** The bar's label ("Sending x.csv", "Checking rows: 3,000 of 100,000", …); null while no bar is shown. */
  label: string | null;
  /** The bar's value in percent; null while it shows no bar or cannot say how far. */
  percent: number | null;
  /** Whether the import's outcome (valid, imported, or the problems) was on the page at that moment. */
  finished: boolean;
}

declare global {
  interface Window {
    __lotsProgress?: ProgressSample[];
  }
}

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
    await this.chooseFile("Dump file (.bin or .hex)", file);
    await this.button("Identify").click();
    return this.dumpResult;
  }

  /** Chooses a detached .sig for the next identification (the app's file picker, like the dump's). */
  async chooseSignature(file: { name: string; mimeType: string; buffer: Buffer }): Promise<void> {
    await this.chooseFile("Signature (.sig, optional)", file);
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
    await this.chooseFile("CSV file", { name, mimeType: "text/csv", buffer: Buffer.from(csv) });
    await this.button("Preview").click();
  }

  get importProblems(): Locator {
    return this.page.getByRole("table", { name: "Problems by row" });
  }

  /** Picks a CSV file in the import form without sending it. */
  async chooseCsv(name: string, csv: string): Promise<void> {
    await this.chooseFile("CSV file", { name, mimeType: "text/csv", buffer: Buffer.from(csv) });
  }

  get previewButton(): Locator {
    return this.button("Preview");
  }

  get importButton(): Locator {
    return this.button("Import");
  }

  get progressBar(): Locator {
    return this.page.getByRole("progressbar");
  }

  get progressPercent(): Locator {
    return this.page.getByTestId("upload-percent");
  }

  get cancelUpload(): Locator {
    return this.button("Cancel upload");
  }

  get uploadCancelled(): Locator {
    return this.page.getByTestId("upload-cancelled");
  }

  /** What the import ended with: all rows valid, the lots imported, or the problems found. */
  get importOutcome(): Locator {
    return this.page.getByTestId("import-outcome");
  }

  /**
   * Starts recording every state the progress bar is drawn in (label and percent) and whether the
   * outcome was already on the page, from now until `progressSeen` is read. A MutationObserver
   * hears each change the page commits, so a bar that jumped straight to its end is told apart
   * from one that moved while the server worked.
   */
  async watchProgress(): Promise<void> {
    await this.page.evaluate(() => {
      window.__lotsProgress = [];
      const record = () => {
        const samples = (window.__lotsProgress ??= []);
        const bar = document.querySelector('[role="progressbar"]');
        const now = bar?.getAttribute("aria-valuenow");
        const sample: ProgressSample = {
          label: bar?.getAttribute("aria-label") ?? null,
          percent: now === null || now === undefined ? null : Number(now),
          finished: document.querySelector('[data-testid="import-outcome"]') !== null,
        };
        const last = samples.at(-1);
        if (!last || last.label !== sample.label || last.percent !== sample.percent || last.finished !== sample.finished) samples.push(sample);
      };
      record();
      new MutationObserver(record).observe(document.body, { subtree: true, childList: true, attributes: true, characterData: true });
    });
  }

  /** The progress states drawn since `watchProgress`, and clears the record for the next step. */
  async progressSeen(): Promise<ProgressSample[]> {
    return this.page.evaluate(() => {
      const seen = window.__lotsProgress ?? [];
      window.__lotsProgress = [];
      return seen;
    });
  }
}
