import type { Locator } from "@playwright/test";
import { Screen } from "./screen";

/** /admin/users: people, their roles and state, and the form that adds one. */
export class UsersAdmin extends Screen {
  async goto(): Promise<this> {
    await this.page.goto("/admin/users");
    return this;
  }

  async add({ name, email, role, password }: { name: string; email: string; role: string; password: string }): Promise<void> {
    await this.page.getByLabel("Name").fill(name);
    await this.page.getByLabel("E-mail").fill(email);
    await this.page.getByLabel("Role", { exact: true }).selectOption(role);
    await this.page.getByLabel("First password").fill(password);
    await this.button("Create user").click();
  }

  row(email: string): Locator {
    return this.page.getByRole("row").filter({ hasText: email });
  }

  async disable(email: string): Promise<void> {
    await this.disableButton(email).click();
  }

  disableButton(email: string): Locator {
    return this.row(email).getByRole("button", { name: /^Disable\b/ });
  }

  reenableButton(email: string): Locator {
    return this.row(email).getByRole("button", { name: /^Re-enable\b/ });
  }

  roleOf(email: string, name: string): Locator {
    return this.row(email).getByLabel(`Role of ${name}`);
  }

  /** Picks a new role in the person's row, which asks for confirmation first. */
  async pickRole(email: string, name: string, role: string): Promise<void> {
    await this.roleOf(email, name).selectOption(role);
  }

  /** The confirmation dialog's confirm button ("Change role", "Disable account"). */
  async confirm(dialogTitle: string | RegExp, action: string): Promise<void> {
    await this.dialog(dialogTitle).getByRole("button", { name: action, exact: true }).click();
  }

  /** What the last change to a person did, said once it succeeded. */
  get changeDone(): Locator {
    return this.panel("People").getByRole("status");
  }

  /** The add form's panel. */
  get addForm(): Locator {
    return this.panel("Add a user");
  }

  private panel(title: string): Locator {
    return this.page.locator("section").filter({ has: this.page.getByRole("heading", { name: title, level: 2, exact: true }) });
  }

  /** The add form's refusal (the server's or the fields'). */
  get addError(): Locator {
    return this.addForm.getByRole("alert");
  }

  get addedNotice(): Locator {
    return this.addForm.getByRole("status").filter({ hasText: "User created." });
  }
}

/** /admin/mailbox: what the app sent, as the local stand-in for mail received it. */
export class MailboxPage extends Screen {
  async goto(): Promise<this> {
    await this.page.goto("/admin/mailbox");
    return this;
  }

  message(subject: string): Locator {
    return this.page.getByText(subject).first();
  }
}

/** /admin/audit: every change with who made it, filtered and paged. */
export class AuditLogPage extends Screen {
  async goto(filter: Record<string, string> = {}): Promise<this> {
    const qs = new URLSearchParams(filter).toString();
    await this.page.goto(qs ? `/admin/audit?${qs}` : "/admin/audit");
    return this;
  }

  get table(): Locator {
    return this.page.getByRole("table", { name: "Audit events" });
  }
}
