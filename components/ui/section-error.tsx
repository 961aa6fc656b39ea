"use client";

import Link from "next/link";
import { Button } from "./button";
import { Notice } from "./notice";

/**
 * What a section shows (its `error.tsx`) when its page could not be built on the server: the
 * menu stays usable, the reason in plain words, and a way to try again. The server's own
 * message is never shown (it is logged); the digest lets support find it in the log.
 */
export function SectionError({ what, error, retry }: { what: string; error: Error & { digest?: string }; retry: () => void }) {
  return (
    <div className="max-w-2xl space-y-3">
      <h1>Could not show {what}</h1>
      <Notice tone="fault" role="alert" title={`Loading ${what} failed.`}>
        If the database is restarting, this clears up by itself in a moment; otherwise try again, or go back to the dashboard.
        {error.digest && <p className="mt-1 text-xs">Reference for support: <code>{error.digest}</code></p>}
      </Notice>
      <div className="flex gap-2">
        <Button onClick={retry}>Try again</Button>
        <Link href="/" className="inline-flex items-center rounded px-3 py-1.5 text-sm">
          Dashboard
        </Link>
      </div>
    </div>
  );
}
