import type { z } from "zod";
import type { componentsQuery, coolerModelsQuery } from "./operations/registry";

/**
 * Limits and fixed queries of the API that screens show or send, as plain values: the
 * operations modules re-export them beside their schemas, and browser code imports them from
 * here so that it does not load zod with them.
 */

/** Token policy: a token lives at most this many days, then a new one is made. */
export const MAX_TOKEN_DAYS = 90;
/** Token policy: at most this many live (not revoked, not expired) tokens per user. */
export const MAX_LIVE_TOKENS = 10;

/** Largest profile document accepted anywhere (draft, import, publish), bytes. */
export const MAX_PROFILE_BYTES = 256 * 1024;

/** Largest lots CSV: 100,000 lots of about 80 bytes a row, with room for longer codes and lines. */
export const MAX_LOTS_CSV_BYTES = 16 * 1024 * 1024;

/** Largest controller dump accepted for identification, bytes. */
export const MAX_DUMP_BYTES = 256 * 1024;

/** The first hundred fans and pumps: what pickers offer. */
export const ALL_COMPONENTS = { pageSize: 100, sort: "name" } as const satisfies z.input<typeof componentsQuery>;

/** The first hundred cooler models by name: what pickers offer. */
export const ALL_COOLERS = { pageSize: 100, sort: "name" } as const satisfies z.input<typeof coolerModelsQuery>;
