import type { Metadata } from "next";
import Image from "next/image";
import { redirect } from "next/navigation";
import { getSessionActor } from "@/lib/platform/auth/actor";
import { SignInForm } from "@/components/auth/sign-in-form";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  if (await getSessionActor()) redirect("/");
  const sp = await searchParams;
  const raw = typeof sp.callbackUrl === "string" ? sp.callbackUrl : "/";
  // Only same-site paths: a sign-in link must not forward anyone elsewhere.
  const callbackUrl = raw.startsWith("/") && !raw.startsWith("//") ? raw : "/";
  return (
    <main className="flex min-h-screen items-center justify-center bg-ink-900 px-4">
      <div className="w-full max-w-sm rounded-md bg-white p-7 shadow-panel">
        <div className="mb-6 flex items-center gap-2.5">
          <Image src="/logo.svg" alt="" width={32} height={32} priority />
          <div>
            <p className="text-xl font-semibold tracking-tight">Loopkeeper</p>
            <p className="text-xs text-ink-600">Curves, boards and builds for cooler controllers</p>
          </div>
        </div>
        <h1 className="mb-4 text-lg">Sign in</h1>
        <SignInForm callbackUrl={callbackUrl} />
      </div>
    </main>
  );
}
