import { ANY_UUID, type AccessRow } from "./types";

const CREATE = ["admin", "engineer", "release_manager"] as const;
const REVIEW = ["admin", "engineer"] as const;
const PROMOTE = ["admin", "release_manager"] as const;

export const buildRows: AccessRow[] = [
  { file: "app/(app)/builds/(pipeline)/page.tsx", kind: "page", method: "GET", url: "/builds", allowed: "all" },
  { file: "app/(app)/builds/new/page.tsx", kind: "page", method: "GET", url: "/builds/new", allowed: CREATE },
  { file: "app/(app)/builds/[id]/page.tsx", kind: "page", method: "GET", url: `/builds/${ANY_UUID}`, allowed: "all", ok: [200, 404] },
  { file: "app/(app)/admin/mailbox/page.tsx", kind: "page", method: "GET", url: "/admin/mailbox", allowed: ["admin"] },

  { file: "app/api/v1/builds/route.ts", kind: "api", method: "GET", url: "/api/v1/builds", allowed: "all" },
  { file: "app/api/v1/builds/route.ts", kind: "api", method: "POST", url: "/api/v1/builds", body: { version: "x" }, allowed: CREATE, ok: 422 },
  { file: "app/api/v1/builds/options/route.ts", kind: "api", method: "GET", url: "/api/v1/builds/options", allowed: CREATE },
  { file: "app/api/v1/builds/[id]/route.ts", kind: "api", method: "GET", url: `/api/v1/builds/${ANY_UUID}`, allowed: "all", ok: 404 },
  { file: "app/api/v1/builds/[id]/gate/route.ts", kind: "api", method: "GET", url: `/api/v1/builds/${ANY_UUID}/gate`, allowed: "all", ok: 404 },
  { file: "app/api/v1/builds/[id]/transitions/route.ts", kind: "api", method: "POST", url: `/api/v1/builds/${ANY_UUID}/transitions`, body: { from: "nowhere" }, allowed: CREATE, ok: 422 },
  { file: "app/api/v1/builds/[id]/reviews/route.ts", kind: "api", method: "POST", url: `/api/v1/builds/${ANY_UUID}/reviews`, body: { verdict: "maybe" }, allowed: REVIEW, ok: 422 },
  { file: "app/api/v1/builds/[id]/reviews/[reviewId]/route.ts", kind: "api", method: "PATCH", url: `/api/v1/builds/${ANY_UUID}/reviews/${ANY_UUID}`, body: { verdict: "maybe" }, allowed: REVIEW, ok: 422 },
  { file: "app/api/v1/builds/[id]/reviews/[reviewId]/resolve/route.ts", kind: "api", method: "POST", url: `/api/v1/builds/${ANY_UUID}/reviews/${ANY_UUID}/resolve`, allowed: CREATE, ok: 404 },
  { file: "app/api/v1/builds/[id]/waiver/route.ts", kind: "api", method: "POST", url: `/api/v1/builds/${ANY_UUID}/waiver`, body: { reason: "" }, allowed: PROMOTE, ok: 422 },
  { file: "app/api/v1/builds/[id]/evidence/route.ts", kind: "api", method: "POST", url: `/api/v1/builds/${ANY_UUID}/evidence`, allowed: PROMOTE, ok: 400 },
  { file: "app/api/v1/builds/[id]/bank/route.ts", kind: "api", method: "GET", url: `/api/v1/builds/${ANY_UUID}/bank?format=bin`, allowed: "all", ok: 404 },
  { file: "app/api/v1/builds/[id]/vectors/route.ts", kind: "api", method: "GET", url: `/api/v1/builds/${ANY_UUID}/vectors`, allowed: "all", ok: 404 },
  { file: "app/api/v1/uploads/route.ts", kind: "api", method: "POST", url: "/api/v1/uploads", allowed: CREATE, ok: 400 },
  { file: "app/api/v1/uploads/[id]/route.ts", kind: "api", method: "GET", url: `/api/v1/uploads/${ANY_UUID}`, allowed: "all", ok: 404 },
  { file: "app/api/v1/mailbox/route.ts", kind: "api", method: "GET", url: "/api/v1/mailbox", allowed: ["admin"] },
];
