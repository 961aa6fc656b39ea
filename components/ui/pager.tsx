"use client";

import Link from "next/link";
import { usePathname, useSearchParams } from "next/navigation";
import { buttonClass } from "@/components/ui/button";

/**
 * The one pager under every paged list. The page lives in the URL (`?page=N`, other filters
 * kept), so its steps are plain links: they work before the scripts load and a page can be
 * shared. Lists that know their total show "Page 2 of 7 · 130 in all"; lists that only know
 * whether more rows follow (newest-first logs) pass `hasMore`.
 */
export function Pager({
  page,
  total,
  pageSize,
  hasMore,
  previousLabel = "Previous",
  nextLabel = "Next",
  label = "Pages",
}: {
  page: number;
  total?: number;
  pageSize?: number;
  hasMore?: boolean;
  previousLabel?: string;
  nextLabel?: string;
  label?: string;
}) {
  const pathname = usePathname();
  const sp = useSearchParams();
  const lastPage = total !== undefined && pageSize ? Math.max(1, Math.ceil(total / pageSize)) : undefined;
  const canNext = lastPage !== undefined ? page < lastPage : !!hasMore;
  const href = (p: number) => {
    const next = new URLSearchParams(sp.toString());
    if (p <= 1) next.delete("page");
    else next.set("page", String(p));
    const qs = next.toString();
    return qs ? `${pathname}?${qs}` : pathname;
  };
  return (
    <nav aria-label={label} className="mt-3 flex items-center gap-2 text-sm">
      <Step href={page > 1 ? href(page - 1) : null}>{previousLabel}</Step>
      <span className="tabular-nums text-ink-600" data-testid="pager-status">
        Page {page}
        {lastPage !== undefined ? ` of ${lastPage}` : ""}
        {total !== undefined ? ` · ${total} in all` : ""}
      </span>
      <Step href={canNext ? href(page + 1) : null}>{nextLabel}</Step>
    </nav>
  );
}

function Step({ href, children }: { href: string | null; children: string }) {
  if (!href) {
    return (
      <span aria-disabled="true" className={buttonClass("secondary", "cursor-not-allowed text-ink-400 hover:bg-white")}>
        {children}
      </span>
    );
  }
  return (
    <Link href={href} replace scroll={false} className={buttonClass("secondary", "no-underline hover:no-underline")}>
      {children}
    </Link>
  );
}
