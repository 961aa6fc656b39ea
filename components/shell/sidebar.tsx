"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import { can, type Role } from "@/lib/auth/roles";
import { NAV, activeNavHref } from "./nav";

export function Sidebar({ role }: { role: Role }) {
  const pathname = usePathname();
  const current = activeNavHref(pathname, NAV.flatMap((g) => g.items.filter((i) => can(role, i.capability)).map((i) => i.href)));
  return (
    <nav aria-label="Main" className="space-y-5">
      {NAV.map((group) => {
        const items = group.items.filter((i) => can(role, i.capability));
        if (!items.length) return null;
        return (
          <div key={group.label}>
            <p className="px-2 pb-1 text-xs font-semibold uppercase tracking-wider text-ink-400">{group.label}</p>
            <ul className="space-y-0.5">
              {items.map((item) => {
                const active = item.href === current;
                return (
                  <li key={item.href}>
                    <Link
                      href={item.href}
                      aria-current={active ? "page" : undefined}
                      className={`block rounded px-2 py-1.5 text-sm no-underline ${active ? "bg-ink-800 font-medium text-white" : "text-ink-200 hover:bg-ink-800 hover:text-white"}`}
                    >
                      {item.label}
                    </Link>
                  </li>
                );
              })}
            </ul>
          </div>
        );
      })}
    </nav>
  );
}
