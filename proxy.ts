import { NextResponse, type NextRequest } from "next/server";
import { getToken } from "next-auth/jwt";

/**
 * Sends signed-out visitors of screens to sign-in. This is a convenience, not the check:
 * every page, route and action verifies the session and role on the server itself.
 */
export async function proxy(req: NextRequest) {
  const token = await getToken({ req, secret: process.env.NEXTAUTH_SECRET });
  if (token) return NextResponse.next();
  const url = req.nextUrl.clone();
  url.pathname = "/sign-in";
  url.search = `?callbackUrl=${encodeURIComponent(req.nextUrl.pathname + req.nextUrl.search)}`;
  return NextResponse.redirect(url);
}

export const config = {
  // Screens only: API routes answer 401 themselves; assets and sign-in stay open.
  matcher: ["/((?!api/|_next/|sign-in|favicon.ico|icon.svg|logo.svg|fonts/).*)"],
};
