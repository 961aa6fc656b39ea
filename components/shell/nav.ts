import type { Capability } from "@/lib/auth/roles";

export interface NavItem {
  href: string;
  label: string;
  capability: Capability;
}

export interface NavGroup {
  label: string;
  items: NavItem[];
}

/** The sidebar; each entry is shown only to roles with its capability (the pages check again on the server). */
export const NAV: NavGroup[] = [
  { label: "Overview", items: [{ href: "/", label: "Dashboard", capability: "read" }] },
  {
    label: "Registry",
    items: [
      { href: "/profiles", label: "Profiles", capability: "read" },
      { href: "/boards", label: "Boards", capability: "read" },
      { href: "/cooler-models", label: "Cooler models", capability: "read" },
      { href: "/components", label: "Components", capability: "read" },
    ],
  },
  {
    label: "Release",
    items: [
      { href: "/builds", label: "Builds", capability: "read" },
      { href: "/builds/new", label: "New build", capability: "build:create" },
    ],
  },
  {
    label: "Support",
    items: [
      { href: "/lookup", label: "Serial lookup", capability: "support" },
      { href: "/lots", label: "Production lots", capability: "read" },
      { href: "/support/withdrawn", label: "Withdrawn builds", capability: "support" },
    ],
  },
  {
    label: "Admin",
    items: [
      { href: "/admin/users", label: "Users and roles", capability: "admin" },
      { href: "/admin/audit", label: "Audit log", capability: "admin" },
      { href: "/admin/mailbox", label: "Mailbox", capability: "admin" },
    ],
  },
];

/**
 * The one entry to highlight for a path: the entry whose address is the longest that the path
 * is or lies under ("/builds/new" is New build, not also Builds; "/builds/1f…" is Builds).
 */
export function activeNavHref(pathname: string, hrefs: readonly string[]): string | undefined {
  const matches = hrefs.filter((h) => (h === "/" ? pathname === "/" : pathname === h || pathname.startsWith(`${h}/`)));
  return matches.sort((a, b) => b.length - a.length)[0];
}
