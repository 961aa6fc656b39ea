import "server-only";
import type { NextAuthOptions } from "next-auth";
import CredentialsProvider from "next-auth/providers/credentials";
import { z } from "zod";
import { getDb } from "@/db/client";
import { getUserByEmail } from "@/db/users";
import { clearFailures, recordFailure, secondsLocked } from "@/db/throttle";
import { burnPasswordCheck, verifyPassword } from "@/lib/platform/auth/password";
import { env } from "@/lib/platform/env";

const credentialsSchema = z.object({ email: z.string().trim().min(1).max(320), password: z.string().min(1).max(1024) });

/** The message for every failed sign-in: it never says whether the account exists. */
export const SIGN_IN_FAILED = "CredentialsSignin";

function clientAddress(headers: Record<string, unknown> | undefined): string {
  const fwd = headers?.["x-forwarded-for"];
  if (typeof fwd === "string" && fwd) return fwd.split(",")[0]!.trim();
  return "local";
}

export function authOptions(): NextAuthOptions {
  return {
    secret: env().NEXTAUTH_SECRET,
    session: { strategy: "jwt", maxAge: 8 * 60 * 60 },
    pages: { signIn: "/sign-in", error: "/sign-in" },
    providers: [
      CredentialsProvider({
        name: "Loopkeeper account",
        credentials: { email: { label: "E-mail", type: "email" }, password: { label: "Password", type: "password" } },
        async authorize(raw, req) {
          const parsed = credentialsSchema.safeParse(raw);
          if (!parsed.success) return null;
          const { email, password } = parsed.data;
          const db = getDb();
          const accountKey = `acct:${email.toLowerCase()}`;
          const addressKey = `addr:${clientAddress(req?.headers)}`;
          if ((await secondsLocked(db, { keys: [accountKey, addressKey] })) > 0) {
            await burnPasswordCheck(password);
            return null;
          }
          const user = await getUserByEmail(db, { email });
          const ok = user ? await verifyPassword(password, user.passwordHash) : await burnPasswordCheck(password);
          if (!user || !ok || user.disabledAt) {
            await recordFailure(db, { keys: [accountKey] });
            await recordFailure(db, { keys: [addressKey], maxFailures: 100 });
            return null;
          }
          await clearFailures(db, { keys: [accountKey] });
          return { id: user.id, email: user.email, name: user.name, role: user.role, epoch: user.sessionEpoch };
        },
      }),
    ],
    callbacks: {
      jwt({ token, user }) {
        if (user) {
          const u = user as unknown as { id: string; role: string; epoch: number };
          token.uid = u.id;
          token.role = u.role;
          token.epoch = u.epoch;
        }
        return token;
      },
      session({ session, token }) {
        return { ...session, user: { ...session.user, id: token.uid, role: token.role, epoch: token.epoch } };
      },
    },
  };
}
