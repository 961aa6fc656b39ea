import type { Role } from "@/lib/auth/roles";

export { ROLES } from "@/lib/auth/roles";
export type RoleName = Role;

/**
 * One row of the role matrix: a page or an API operation, a concrete URL to call and the
 * roles that may use it. Expected statuses follow from `allowed`:
 * - pages: signed out → redirect to sign-in; allowed role → `ok` (default 200); others → 403.
 * - API: signed out, revoked or expired token → 401; allowed role → `ok`; others → 403.
 * Write rows send a body that is invalid on purpose, so an allowed role proves it got past
 * the role check (400/404/422) without changing any data.
 */
export interface AccessRow {
  /** The file that serves it, relative to the repo root, e.g. app/api/v1/users/route.ts. */
  file: string;
  kind: "page" | "api";
  method: "GET" | "POST" | "PUT" | "PATCH" | "DELETE";
  url: string;
  body?: unknown;
  /** "public" = no sign-in; "all" = every signed-in role. */
  allowed: readonly RoleName[] | "all" | "public";
  /** Status for allowed callers; a list when either is right (e.g. 404 for an unknown id). */
  ok?: number | number[];
}

export const ANY_UUID = "00000000-0000-4000-8000-000000000000";
