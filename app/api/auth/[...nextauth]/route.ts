import NextAuth from "next-auth";
import { authOptions } from "@/lib/platform/auth/options";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

async function handler(req: Request, ctx: { params: Promise<{ nextauth: string[] }> }) {
  // next-auth v4 reads params synchronously; Next 16 hands them over as a promise.
  const params = await ctx.params;
  return (NextAuth(authOptions()) as (r: Request, c: { params: { nextauth: string[] } }) => Promise<Response>)(req, { params });
}

export { handler as GET, handler as POST };
