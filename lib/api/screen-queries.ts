/**
 * Queries that a screen's server render and its browser code must name identically, so the
 * answer the server puts in the page is the one the browser's query finds. Plain values, so
 * both a server page and a client component can import them.
 */

/** The filters the profile list reads from its URL. */
export const PROFILE_FILTERS = ["q", "coolerModelId"] as const;

/** The filters the component list reads from its URL. */
export const COMPONENT_FILTERS = ["q", "kind"] as const;

/** The filters the cooler-model list reads from its URL. */
export const COOLER_FILTERS = ["q"] as const;

/** The lot list's URL state: filters, sort and direction (its page is read separately). */
export const LOT_FILTERS = ["board", "build", "code", "sort", "dir"] as const;

/** The audit log's filters. */
export const AUDIT_FILTERS = ["action", "entityType", "actor", "from", "to"] as const;

/**
 * A list's API query from its URL for lists that page by "more follows" (lots, audit): the
 * filters that are set and the page, nothing else, exactly as the browser sends it.
 */
export function pagedQueryFromUrl(keys: readonly string[], sp: { get(name: string): string | null }): Record<string, string> {
  const query: Record<string, string> = {};
  for (const k of keys) {
    const v = sp.get(k);
    if (v) query[k] = v;
  }
  query.page = String(Math.max(1, Number(sp.get("page") ?? "1") || 1));
  return query;
}
