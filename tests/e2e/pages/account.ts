import type { Locator } from "@playwright/test";
import { Screen } from "./screen";

/** /account: the password form and the person's API tokens. */
export class AccountPage extends Screen {
  async goto(): Promise<this> {
    await this.page.goto("/account");
    return this;
  }

  /** Fills the token form and presses Create token. */
  async createToken(name: string, days?: number): Promise<void> {
    await this.page.getByLabel("Name", { exact: true }).fill(name);
    if (days !== undefined) await this.page.getByLabel("Valid for (days)").fill(String(days));
    await this.button("Create token").click();
  }

  /** The secret of the token just made, shown this once. */
  get newSecret(): Locator {
    return this.page.getByTestId("new-token-secret");
  }

  get copySecret(): Locator {
    return this.button("Copy token");
  }

  /** What the copy button said it did. */
  get copyStatus(): Locator {
    return this.page.getByRole("status").filter({ hasText: /^(Copied to the clipboard\.|The browser did not allow copying)/ });
  }

  get tokens(): Locator {
    return this.page.getByRole("table", { name: "Your API tokens" });
  }

  /** The scrolling region around the token table. */
  get tokensRegion(): Locator {
    return this.page.getByRole("region", { name: "Your API tokens" });
  }

  tokenRow(name: string): Locator {
    return this.tokens.getByRole("row").filter({ hasText: name });
  }

  /** One cell of a token's row, by its column heading. */
  async tokenCell(name: string, column: "Name" | "Starts with" | "Created" | "Expires" | "Last used" | "State"): Promise<Locator> {
    const headings = (await this.tokens.getByRole("columnheader").allTextContents()).map((t) => t.trim());
    const at = headings.indexOf(column);
    if (at < 0) throw new Error(`The token table has no column "${column}" (it has ${headings.join(", ")}).`);
    return this.tokenRow(name).getByRole("cell").nth(at);
  }
}
