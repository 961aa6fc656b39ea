import type { Locator } from "@playwright/test";
import { Screen } from "./screen";

/** /: builds by stage, reviews waiting, and the recent activity in sentences. */
export class DashboardPage extends Screen {
  async goto(): Promise<this> {
    await this.page.goto("/");
    return this;
  }

  get activity(): Locator {
    return this.page.getByRole("table", { name: "Recent activity" });
  }

  /** The "What happened" cell of every activity row, newest first. */
  get activitySentences(): Locator {
    return this.activity.locator("tbody tr td:nth-child(2)");
  }

  /** The activity row that reads `sentence`. */
  activityEntry(sentence: string): Locator {
    return this.activitySentences.filter({ hasText: sentence });
  }
}
