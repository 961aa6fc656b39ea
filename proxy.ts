import { NextResponse, type NextRequest } from "next/server";
import { getToken } from "next-auth/jwt";
import { checkDatabase } from "@/db/health";
import { newNonce, screenPolicy } from "@/lib/platform/http/content-security";

const UNAVAILABLE_HTML = `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Loopkeeper is unavailable</title></head>
<body style="font-family:system-ui,sans-serif;max-width:40rem;margin:4rem auto;padding:0 1rem;color:#1c1b18">
<h1>Loopkeeper cannot reach its database</h1>
<p>The registry is temporarily unavailable. Nothing you entered was half-saved. This page recovers by itself when the database is back; try again in a few seconds.</p>
</body></html>`;

/**
 * Screens only. Answers 503 with a plain explanation while PostgreSQL is unreachable, and
 * sends signed-out visitors to sign-in. The redirect is a convenience, not the check: every
 * page, route and action verifies the session and role on the server itself.
 */
export async function proxy(req: NextRequest) {
  const policy = screenPolicy(newNonce(), process.env.NODE_ENV === "development");
  const db = await checkDatabase();
  if (!db.ok) {
    return withHeaders(new NextResponse(UNAVAILABLE_HTML, { status: 503, headers: { "content-type": "text/html; charset=utf-8", "retry-after": "5", "cache-control": "no-store" } }), policy);
  }
  if (req.nextUrl.pathname === "/sign-in") return render(req, policy);
  const token = await getToken({ req, secret: process.env.NEXTAUTH_SECRET });
  if (token) return render(req, policy);
  const url = req.nextUrl.clone();
  url.pathname = "/sign-in";
  url.search = `?callbackUrl=${encodeURIComponent(req.nextUrl.pathname + req.nextUrl.search)}`;
  return withHeaders(NextResponse.redirect(url), policy);
}

/** Renders the screen with the policy on the request too: the framework reads its nonce from there and puts it on every script it writes. */
function render(req: NextRequest, policy: string): NextResponse {
  const headers = new Headers(req.headers);
  headers.set("content-security-policy", policy);
  return withHeaders(NextResponse.next({ request: { headers } }), policy);
}

/** The screen's policy, and HSTS once the app is served over https (read at run time, not build time). */
function withHeaders(res: NextResponse, policy: string): NextResponse {
  res.headers.set("content-security-policy", policy);
  if (process.env.NEXTAUTH_URL?.startsWith("https:")) res.headers.set("strict-transport-security", "max-age=31536000; includeSubDomains");
  return res;
}

export const config = {
  // API routes answer for themselves (401 JSON, 503 JSON); assets stay open.
  matcher: ["/((?!api/|_next/|favicon.ico|icon.svg|logo.svg|fonts/).*)"],
};
