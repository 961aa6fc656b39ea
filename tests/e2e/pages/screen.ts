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

  /**
   * Chooses a file in one of the app's file pickers that wait for a button press before sending
   * (not the evidence pickers, which send at once) and waits until the picker shows it as chosen
   * (its Remove button). A choice made before the page's scripts have attached is not
   * seen by the screen, so the choice is made again until it is: on a busy machine the input
   * can be there, from the server's HTML, a moment before it works.
   */
  async chooseFile(label: string, file: { name: string; mimeType: string; buffer: Buffer }): Promise<void> {
    const input = this.page.getByLabel(label);
    await expect(async () => {
      await input.setInputFiles(file);
      await expect(this.page.getByRole("button", { name: `Remove ${file.name}`, exact: true })).toBeVisible({ timeout: 2_000 });
    }).toPass({ timeout: 60_000 });
  }

  /**
   * Presses a button that opens something on this screen (a form, a panel) and waits until it is
   * shown, pressing again while it is not: a press that lands before the page's scripts have
   * attached does nothing, and on a busy machine the button is there, from the server's HTML, a
   * moment before it works. Only for buttons that open — pressing twice must be harmless.
   */
  async pressUntilShown(button: Locator, shown: Locator): Promise<void> {
    await expect(async () => {
      await button.click();
      await expect(shown).toBeVisible({ timeout: 2_000 });
    }).toPass({ timeout: 60_000 });
  }

  async expectAccessible(): Promise<void> {
    await expectAccessible(this.page);
  }

  /** The one pager under paged lists. */
  get pager(): Locator {
    return this.page.getByTestId("pager-status");
  }

  /** The sidebar. */
  get sidebar(): Locator {
    return this.page.getByRole("navigation", { name: "Main" });
  }

  /** The sidebar entries marked as the current page (one, when the sidebar is right). */
  get currentNavEntries(): Locator {
    return this.sidebar.locator('a[aria-current="page"]');
  }

  /**
   * How a control is drawn: its element, whether it has a fill or an outline (a background, a
   * border or a ring), and its side padding. The app's buttons have all three; a bare text link
   * has none.
   */
  async lookOf(control: Locator): Promise<{ tag: string; boxed: boolean; paddingXPx: number }> {
    return control.evaluate((el) => {
      const s = getComputedStyle(el);
      const filled = s.backgroundColor !== "rgba(0, 0, 0, 0)" && s.backgroundColor !== "transparent";
      const bordered = parseFloat(s.borderTopWidth) > 0 && s.borderTopStyle !== "none";
      const ringed = s.boxShadow !== "none" && s.boxShadow !== "";
      return { tag: el.tagName, boxed: filled || bordered || ringed, paddingXPx: Math.min(parseFloat(s.paddingLeft), parseFloat(s.paddingRight)) };
    });
  }

  /** The control is a button drawn as one (see `lookOf`). */
  async expectLooksLikeButton(control: Locator): Promise<void> {
    await expect(control).toBeVisible();
    const look = await this.lookOf(control);
    expect(look.tag, "a real button element").toBe("BUTTON");
    expect(look.boxed, "a fill, border or ring around the label").toBe(true);
    expect(look.paddingXPx, "padding either side of the label").toBeGreaterThanOrEqual(6);
  }

  async expectNoButton(name: string): Promise<void> {
    await expect(this.button(name)).toHaveCount(0);
  }
}
