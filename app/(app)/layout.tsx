import Link from "next/link";
import { requirePageActor } from "@/lib/platform/auth/page-guard";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { Providers } from "@/components/providers";
import { Sidebar } from "@/components/shell/sidebar";
import { SignOutButton } from "@/components/shell/sign-out-button";

export default async function AppLayout({ children }: { children: React.ReactNode }) {
  const actor = await requirePageActor("read");
  return (
    <Providers>
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:bg-white focus:px-3 focus:py-2">
        Skip to content
      </a>
      <div className="flex min-h-screen">
        <aside className="flex w-56 shrink-0 flex-col bg-ink-900 px-3 py-4 text-ink-100">
          <Link href="/" className="mb-6 flex items-center gap-2 px-2 text-white no-underline hover:no-underline">
            {/* A fixed-size SVG needs no image optimization; next/image would add its browser code to every page. */}
            {/* eslint-disable-next-line @next/next/no-img-element */}
            <img src="/logo.svg" alt="" width={26} height={26} />
            <span className="text-lg font-semibold tracking-tight">Loopkeeper</span>
          </Link>
          <Sidebar role={actor.role} />
          <div className="mt-auto space-y-1 border-t border-ink-700 px-2 pt-3">
            <Link href="/account" className="block text-sm font-medium text-white no-underline hover:underline" data-testid="current-user">
              {actor.name}
            </Link>
            <p className="text-xs text-ink-300" data-testid="current-role">
              {ROLE_LABELS[actor.role]}
            </p>
            <SignOutButton />
          </div>
        </aside>
        <main id="main" className="min-w-0 flex-1 px-8 py-6">
          {children}
        </main>
      </div>
    </Providers>
  );
}
