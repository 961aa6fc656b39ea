import { ANY_UUID, type AccessRow } from "./types";

export const foundationRows: AccessRow[] = [
  { file: "app/(auth)/sign-in/page.tsx", kind: "page", method: "GET", url: "/sign-in", allowed: "public", ok: [200, 307] },
  { file: "app/(app)/page.tsx", kind: "page", method: "GET", url: "/", allowed: "all" },
  { file: "app/(app)/account/page.tsx", kind: "page", method: "GET", url: "/account", allowed: "all" },
  { file: "app/(app)/admin/users/page.tsx", kind: "page", method: "GET", url: "/admin/users", allowed: ["admin"] },
  { file: "app/(app)/admin/audit/page.tsx", kind: "page", method: "GET", url: "/admin/audit", allowed: ["admin"] },

  { file: "app/api/auth/[...nextauth]/route.ts", kind: "api", method: "GET", url: "/api/auth/csrf", allowed: "public" },
  { file: "app/api/auth/[...nextauth]/route.ts", kind: "api", method: "POST", url: "/api/auth/callback/credentials", allowed: "public", ok: [200, 302, 400, 401, 403] },
  { file: "app/api/health/route.ts", kind: "api", method: "GET", url: "/api/health", allowed: "public" },
  { file: "app/api/health/live/route.ts", kind: "api", method: "GET", url: "/api/health/live", allowed: "public" },
  { file: "app/api/v1/openapi.json/route.ts", kind: "api", method: "GET", url: "/api/v1/openapi.json", allowed: "public" },
  { file: "app/api/v1/me/route.ts", kind: "api", method: "GET", url: "/api/v1/me", allowed: "all" },
  { file: "app/api/v1/me/password/route.ts", kind: "api", method: "POST", url: "/api/v1/me/password", body: { currentPassword: "" }, allowed: "all", ok: 422 },
  { file: "app/api/v1/tokens/route.ts", kind: "api", method: "GET", url: "/api/v1/tokens", allowed: "all" },
  { file: "app/api/v1/tokens/route.ts", kind: "api", method: "POST", url: "/api/v1/tokens", body: { name: "" }, allowed: "all", ok: 422 },
  { file: "app/api/v1/tokens/[id]/route.ts", kind: "api", method: "DELETE", url: `/api/v1/tokens/${ANY_UUID}`, allowed: "all", ok: 404 },
  { file: "app/api/v1/users/route.ts", kind: "api", method: "GET", url: "/api/v1/users", allowed: ["admin"] },
  { file: "app/api/v1/users/route.ts", kind: "api", method: "POST", url: "/api/v1/users", body: { email: "not-an-email" }, allowed: ["admin"], ok: 422 },
  { file: "app/api/v1/users/[id]/route.ts", kind: "api", method: "PATCH", url: `/api/v1/users/${ANY_UUID}`, body: { role: "viewer" }, allowed: ["admin"], ok: 404 },
  { file: "app/api/v1/audit/route.ts", kind: "api", method: "GET", url: "/api/v1/audit", allowed: ["admin"] },
];
