import "server-only";
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { z } from "zod";
import { unsafeTextReason } from "@/lib/validation/text";
import { safeCallbackPath } from "@/lib/auth/callback-url";
import { clientAddress } from "@/lib/platform/http/client-address";
import { env } from "@/lib/platform/env";
import { logger } from "@/lib/platform/log";
import { checkCredentials } from "@/lib/platform/auth/sign-in";
import { getDb } from "@/db/client";
import { endSession, startSession } from "@/db/sessions";

// Refused before anything is looked up: PostgreSQL text cannot hold a NUL, and no address or
// password needs control or direction characters.
const plain = (max: number) => z.string().max(max).refine((s) => !unsafeTextReason(s, { singleLine: true }));
const credentialsSchema = z.object({ email: plain(320).pipe(z.string().trim().min(1)), password: plain(1024).pipe(z.string().min(1)) });

/** A browser session lasts a working day at most. */
export const SESSION_MAX_AGE_SEC = 8 * 60 * 60;

/** The message for every failed sign-in: it never says whether the account exists. */
export const SIGN_IN_FAILED = "CredentialsSignin";

export function authOptions(): NextAuthOptions {
  return {
    secret: env().NEXTAUTH_SECRET,
    // Secure (and __Host-/__Secure- prefixed) cookies whenever the app is served over https.
    useSecureCookies: env().NEXTAUTH_URL.startsWith("https:"),
    session: { strategy: "jwt", maxAge: SESSION_MAX_AGE_SEC },
    pages: { signIn: "/sign-in", error: "/sign-in" },
    providers: [
      CredentialsProvider({
        name: "Loopkeeper account",
        credentials: { email: { label: "E-mail", type: "email" }, password: { label: "Password", type: "password" } },
        async authorize(raw, req) {
          const parsed = credentialsSchema.safeParse(raw);
          if (!parsed.success) return null;
          const { email, password } = parsed.data;
          try {
            const result = await checkCredentials({ email, password, client: clientAddress(req?.headers) });
            if (!result.ok) return null;
            const { user } = result;
            return { id: user.id, email: user.email, name: user.name, role: user.role, epoch: user.sessionEpoch };
          } catch (err) {
            // next-auth puts a thrown message into the redirect URL; the cause goes to the log only.
            logger.error({ err: err instanceof Error ? { message: err.message, stack: err.stack } : String(err) }, "sign-in check failed");
            return null;
          }
        },
      }),
    ],
    callbacks: {
      // Same-origin paths only, however the callback address was written.
      redirect({ url, baseUrl }) {
        return `${baseUrl}${safeCallbackPath(url, baseUrl)}`;
      },
      async jwt({ token, user }) {
        if (user) {
          const u = user as unknown as { id: string; role: string; epoch: number };
          token.uid = u.id;
          token.role = u.role;
          token.epoch = u.epoch;
          // Each sign-in is recorded on the server, so it can be ended there (sign-out, password change).
          token.sid = await startSession(getDb(), { userId: u.id, maxAgeSec: SESSION_MAX_AGE_SEC });
        }
        return token;
      },
      session({ session, token }) {
        return { ...session, user: { ...session.user, id: token.uid, role: token.role, epoch: token.epoch, sid: token.sid } };
      },
    },
    events: {
      // Signing out ends the session on the server too: a copied cookie is refused afterwards.
      async signOut({ token }) {
        const sid = (token as { sid?: unknown } | null)?.sid;
        if (typeof sid === "string") await endSession(getDb(), { sessionId: sid });
      },
    },
  };
}
