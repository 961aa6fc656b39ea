import type { Metadata } from "next";
import { cookies } from "next/headers";
import { redirect } from "next/navigation";
import { getSessionActor } from "@/lib/platform/auth/actor";
import { env } from "@/lib/platform/env";
import { safeCallbackPath } from "@/lib/auth/callback-url";
import { SignInForm, SIGN_IN_FAILED_MESSAGE } from "@/components/auth/sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  if (await getSessionActor()) redirect("/");
  const sp = await searchParams;
  // Only same-origin paths, as the URL parser reads them: a sign-in link must not forward anyone elsewhere.
  const callbackUrl = safeCallbackPath(typeof sp.callbackUrl === "string" ? sp.callbackUrl : undefined, env().NEXTAUTH_URL);
  // The form also posts without scripts; next-auth's double-submit token then travels as a field.
  const secure = env().NEXTAUTH_URL.startsWith("https:");
  const csrfCookie = (await cookies()).get(secure ? "__Host-next-auth.csrf-token" : "next-auth.csrf-token")?.value;
  const csrfToken = csrfCookie?.split("|")[0] ?? "";
  const initialError = sp.error ? SIGN_IN_FAILED_MESSAGE : sp.csrf ? "The sign-in form had expired. Enter your e-mail and password again." : null;
  return (
    <main className="flex min-h-screen items-center justify-center bg-ink-900 px-4">
      <div className="w-full max-w-sm rounded-md bg-white p-7 shadow-panel">
        <div className="mb-6 flex items-center gap-2.5">
          {/* A fixed-size SVG needs no image optimization; next/image would add its browser code to the page. */}
          {/* eslint-disable-next-line @next/next/no-img-element */}
          <img src="/logo.svg" alt="" width={32} height={32} />
          <div>
            <p className="text-xl font-semibold tracking-tight">Loopkeeper</p>
            <p className="text-xs text-ink-600">Curves, boards and builds for cooler controllers</p>
          </div>
        </div>
        <h1 className="mb-4 text-lg">Sign in</h1>
        <SignInForm callbackUrl={callbackUrl} csrfToken={csrfToken} initialError={initialError} />
      </div>
    </main>
  );
}
