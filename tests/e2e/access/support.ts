import { ANY_UUID, type AccessRow } from "./types";

const SUPPORT = ["admin", "engineer", "release_manager", "support"] as const;
const LOT_WRITE = ["admin", "release_manager"] as const;

export const supportRows: AccessRow[] = [
  { file: "app/(app)/lookup/page.tsx", kind: "page", method: "GET", url: "/lookup", allowed: SUPPORT },
  { file: "app/(app)/lots/page.tsx", kind: "page", method: "GET", url: "/lots", allowed: "all" },
  { file: "app/(app)/support/withdrawn/page.tsx", kind: "page", method: "GET", url: "/support/withdrawn", allowed: SUPPORT },

  { file: "app/api/v1/lots/route.ts", kind: "api", method: "GET", url: "/api/v1/lots", allowed: "all" },
  { file: "app/api/v1/lots/route.ts", kind: "api", method: "POST", url: "/api/v1/lots", body: { lotCode: "" }, allowed: LOT_WRITE, ok: 422 },
  { file: "app/api/v1/lots/options/route.ts", kind: "api", method: "GET", url: "/api/v1/lots/options", allowed: "all" },
  // A JSON body is the wrong media type for the CSV import: allowed roles get 415, nothing is written.
  { file: "app/api/v1/lots/import/route.ts", kind: "api", method: "POST", url: "/api/v1/lots/import?dryRun=true", body: {}, allowed: LOT_WRITE, ok: 415 },
  { file: "app/api/v1/lots/import/progress/route.ts", kind: "api", method: "POST", url: "/api/v1/lots/import/progress?dryRun=true", body: {}, allowed: LOT_WRITE, ok: 415 },
  { file: "app/api/v1/lookup/route.ts", kind: "api", method: "GET", url: "/api/v1/lookup?serial=not-a-serial", allowed: SUPPORT, ok: 400 },
  { file: "app/api/v1/lookup/recent/route.ts", kind: "api", method: "GET", url: "/api/v1/lookup/recent", allowed: SUPPORT },
  { file: "app/api/v1/dumps/identify/route.ts", kind: "api", method: "POST", url: "/api/v1/dumps/identify", body: {}, allowed: SUPPORT, ok: 415 },
  { file: "app/api/v1/support/withdrawn/route.ts", kind: "api", method: "GET", url: "/api/v1/support/withdrawn", allowed: SUPPORT },
  { file: "app/api/v1/support/withdrawn/[id]/route.ts", kind: "api", method: "GET", url: `/api/v1/support/withdrawn/${ANY_UUID}`, allowed: SUPPORT, ok: 404 },
  { file: "app/api/v1/support/withdrawn/[id]/shipped.csv/route.ts", kind: "api", method: "GET", url: `/api/v1/support/withdrawn/${ANY_UUID}/shipped.csv`, allowed: SUPPORT, ok: 404 },
];
