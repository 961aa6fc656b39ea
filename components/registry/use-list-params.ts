"use client";

import { useUrlParams } from "@/components/ui/use-url-params";
import { listQueryFromUrl } from "@/lib/api/list-query";

/** List state (filters, sort, page) kept in the URL, so a view can be shared and survives reload. */
export function useListParams(keys: readonly string[]) {
  const { sp, set: setUrl } = useUrlParams();
  const page = Math.max(1, Number(sp.get("page") ?? "1") || 1);
  const sort = sp.get("sort") ?? "";
  const dir: "asc" | "desc" = sp.get("dir") === "desc" ? "desc" : "asc";
  // The same reading of the URL the page made on the server for the first page it rendered.
  const query = listQueryFromUrl(keys, sp);

  const set = (next: Record<string, string>) => setUrl(next, { scroll: false });

  return { sp, page, sort, dir, query, set };
}

/**
 * The props a server-paged DataTable takes from its query and the URL list state: one place
 * for sorting (which resets to page 1), the page shown and retry, instead of the same wiring per list.
 */
export function serverTableProps<D>(
  list: ReturnType<typeof useListParams>,
  query: { data: D | undefined; isPending: boolean; error: unknown; refetch: () => Promise<unknown> },
) {
  return {
    data: query.data,
    isPending: query.isPending,
    error: query.error,
    onRetry: () => void query.refetch(),
    sort: list.sort,
    dir: list.dir,
    onSort: (sort: string, dir: "asc" | "desc") => list.set({ sort, dir, page: "" }),
    page: list.page,
  };
}
