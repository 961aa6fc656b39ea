"use client";

import { usePathname, useRouter, useSearchParams } from "next/navigation";

/**
 * Screen state kept in the URL (filters, sort, page), so a view can be shared and survives a
 * reload. `set` merges: an empty value removes the key, other keys stay as they are.
 */
export function useUrlParams() {
  const sp = useSearchParams();
  const router = useRouter();
  const pathname = usePathname();
  function set(next: Record<string, string>, { scroll = true }: { scroll?: boolean } = {}) {
    const p = new URLSearchParams(sp.toString());
    for (const [k, v] of Object.entries(next)) {
      if (v) p.set(k, v);
      else p.delete(k);
    }
    router.replace(`${pathname}?${p.toString()}`, { scroll });
  }
  return { sp, set };
}
