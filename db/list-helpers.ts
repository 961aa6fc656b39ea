import "server-only";
import { asc, desc, type AnyColumn, type SQL } from "drizzle-orm";

/** Offset paging arguments from a page number and size (pages start at 1). */
export function pageWindow({ page, pageSize }: { page: number; pageSize: number }) {
  return { limit: pageSize, offset: (page - 1) * pageSize };
}

/** ORDER BY for a whitelisted sort key, with a stable tie-breaker so pages never overlap. */
export function orderFor<K extends string>(columns: Record<K, AnyColumn | SQL>, sort: K | undefined, dir: "asc" | "desc", fallback: K, tieBreaker: AnyColumn): SQL[] {
  const col = columns[sort ?? fallback];
  return [dir === "desc" ? desc(col) : asc(col), asc(tieBreaker)];
}

/** Escapes LIKE wildcards so a filter matches literally. */
export function likeText(q: string): string {
  return `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}
