import { expect, type Locator, type Page } from "@playwright/test";
import { expectAccessible } from "../support/a11y";

/**
 * What every signed-in screen has: a level-1 heading, alerts for refusals, and the
 * accessibility check. Screen objects below add what their screen offers, named as a
 * person would say it, so specs read as steps and a changed label is fixed in one place.
 */
export class Screen {
  constructor(readonly page: Page) {}

  get heading(): Locator {
    return this.page.getByRole("heading", { level: 1 });
  }

  /** An alert (refusal, warning) that contains `text`. */
  alert(text: string | RegExp): Locator {
    return this.page.getByRole("alert").filter({ hasText: text });
  }

  /** A confirmation dialog, by its title. */
  dialog(name: string | RegExp): Locator {
    return this.page.getByRole("dialog", { name });
  }

  button(name: string | RegExp, exact = true): Locator {
    return this.page.getByRole("button", { name, exact: typeof name === "string" ? exact : undefined });
  }

  async expectAccessible(): Promise<void> {
    await expectAccessible(this.page);
  }

  /** The one pager under paged lists. */
  get pager(): Locator {
    return this.page.getByTestId("pager-status");
  }

  async expectNoButton(name: string): Promise<void> {
    await expect(this.button(name)).toHaveCount(0);
  }
}
