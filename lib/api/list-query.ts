/**
 * A list screen's API query, read from its URL: the named filters that are set, the sort and
 * its direction, and the page. The browser (while the list changes) and the server (when it
 * renders the first page) both call this, so both name the same answer with the same query
 * key and the server's first page is the one the browser would have asked for.
 */
export function listQueryFromUrl(keys: readonly string[], sp: { get(name: string): string | null }): Record<string, string> {
  const query: Record<string, string> = {};
  for (const k of keys) {
    const v = sp.get(k);
    if (v) query[k] = v;
  }
  const sort = sp.get("sort");
  if (sort) query.sort = sort;
  query.dir = sp.get("dir") === "desc" ? "desc" : "asc";
  query.page = String(Math.max(1, Number(sp.get("page") ?? "1") || 1));
  return query;
}

/** A page's `searchParams` prop as the URLSearchParams the browser sees (repeated keys: the first wins, as `get` does). */
export function searchParamsOf(raw: Record<string, string | string[] | undefined>): URLSearchParams {
  const sp = new URLSearchParams();
  for (const [k, v] of Object.entries(raw)) {
    const first = Array.isArray(v) ? v[0] : v;
    if (first !== undefined) sp.set(k, first);
  }
  return sp;
}
