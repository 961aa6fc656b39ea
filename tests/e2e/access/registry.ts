import { ANY_UUID, type AccessRow } from "./types";

const WRITERS = ["admin", "engineer"] as const;

/** Registry and profile pages and routes. Write rows send invalid bodies (or an unknown id) so nothing changes. */
export const registryRows: AccessRow[] = [
  { file: "app/(app)/components/page.tsx", kind: "page", method: "GET", url: "/components", allowed: "all" },
  { file: "app/(app)/cooler-models/page.tsx", kind: "page", method: "GET", url: "/cooler-models", allowed: "all" },
  { file: "app/(app)/boards/page.tsx", kind: "page", method: "GET", url: "/boards", allowed: "all" },
  { file: "app/(app)/board-revisions/[id]/page.tsx", kind: "page", method: "GET", url: `/board-revisions/${ANY_UUID}`, allowed: "all", ok: [200, 404] },
  { file: "app/(app)/profiles/page.tsx", kind: "page", method: "GET", url: "/profiles", allowed: "all" },
  { file: "app/(app)/profiles/[id]/page.tsx", kind: "page", method: "GET", url: `/profiles/${ANY_UUID}`, allowed: "all", ok: [200, 404] },
  { file: "app/(app)/profiles/[id]/compare/page.tsx", kind: "page", method: "GET", url: `/profiles/${ANY_UUID}/compare`, allowed: "all", ok: [200, 404] },

  { file: "app/api/v1/components/route.ts", kind: "api", method: "GET", url: "/api/v1/components?sort=maxRpm&dir=desc", allowed: "all" },
  { file: "app/api/v1/components/route.ts", kind: "api", method: "POST", url: "/api/v1/components", body: { kind: "fan" }, allowed: WRITERS, ok: 422 },
  { file: "app/api/v1/components/[id]/route.ts", kind: "api", method: "PUT", url: `/api/v1/components/${ANY_UUID}`, body: { kind: "fan" }, allowed: WRITERS, ok: 422 },
  { file: "app/api/v1/cooler-models/route.ts", kind: "api", method: "GET", url: "/api/v1/cooler-models", allowed: "all" },
  { file: "app/api/v1/cooler-models/route.ts", kind: "api", method: "POST", url: "/api/v1/cooler-models", body: { name: "" }, allowed: WRITERS, ok: 422 },
  { file: "app/api/v1/cooler-models/[id]/route.ts", kind: "api", method: "PUT", url: `/api/v1/cooler-models/${ANY_UUID}`, body: { name: "" }, allowed: WRITERS, ok: 422 },
  { file: "app/api/v1/board-models/[id]/route.ts", kind: "api", method: "PUT", url: `/api/v1/board-models/${ANY_UUID}`, body: { name: "" }, allowed: WRITERS, ok: 422 },
  { file: "app/api/v1/board-revisions/[id]/route.ts", kind: "api", method: "PUT", url: `/api/v1/board-revisions/${ANY_UUID}`, body: { revision: "x" }, allowed: WRITERS, ok: 422 },
  { file: "app/api/v1/board-models/route.ts", kind: "api", method: "GET", url: "/api/v1/board-models", allowed: "all" },
  { file: "app/api/v1/board-models/route.ts", kind: "api", method: "POST", url: "/api/v1/board-models", body: { name: "" }, allowed: WRITERS, ok: 422 },
  { file: "app/api/v1/board-models/[id]/signing-keys/route.ts", kind: "api", method: "GET", url: `/api/v1/board-models/${ANY_UUID}/signing-keys`, allowed: "all" },
  { file: "app/api/v1/board-models/[id]/revisions/route.ts", kind: "api", method: "POST", url: `/api/v1/board-models/${ANY_UUID}/revisions`, body: { revision: "x" }, allowed: WRITERS, ok: 422 },
  { file: "app/api/v1/board-revisions/[id]/route.ts", kind: "api", method: "GET", url: `/api/v1/board-revisions/${ANY_UUID}`, allowed: "all", ok: 404 },
  { file: "app/api/v1/profiles/route.ts", kind: "api", method: "GET", url: "/api/v1/profiles?sort=updatedAt&dir=desc", allowed: "all" },
  { file: "app/api/v1/profiles/route.ts", kind: "api", method: "POST", url: "/api/v1/profiles", body: { name: "" }, allowed: WRITERS, ok: 422 },
  { file: "app/api/v1/profiles/[id]/route.ts", kind: "api", method: "GET", url: `/api/v1/profiles/${ANY_UUID}`, allowed: "all", ok: 404 },
  { file: "app/api/v1/profiles/[id]/draft/route.ts", kind: "api", method: "PUT", url: `/api/v1/profiles/${ANY_UUID}/draft`, body: { text: "{}", baseRevision: 0 }, allowed: WRITERS, ok: 404 },
  { file: "app/api/v1/profiles/[id]/import/route.ts", kind: "api", method: "POST", url: `/api/v1/profiles/${ANY_UUID}/import`, body: {}, allowed: WRITERS, ok: 404 },
  { file: "app/api/v1/profiles/[id]/versions/route.ts", kind: "api", method: "GET", url: `/api/v1/profiles/${ANY_UUID}/versions`, allowed: "all", ok: 404 },
  { file: "app/api/v1/profiles/[id]/versions/route.ts", kind: "api", method: "POST", url: `/api/v1/profiles/${ANY_UUID}/versions`, body: { version: "x" }, allowed: WRITERS, ok: 422 },
  { file: "app/api/v1/profile-versions/[id]/route.ts", kind: "api", method: "GET", url: `/api/v1/profile-versions/${ANY_UUID}`, allowed: "all", ok: 404 },
  { file: "app/api/v1/profile-versions/[id]/download/route.ts", kind: "api", method: "GET", url: `/api/v1/profile-versions/${ANY_UUID}/download`, allowed: "all", ok: 404 },
];
