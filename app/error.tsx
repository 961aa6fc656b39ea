"use client";

export default function ErrorPage({ retry }: { error: Error; retry: () => void }) {
  return (
    <main className="mx-auto max-w-lg px-6 py-20">
      <h1>Something went wrong</h1>
      <p className="mt-2 text-ink-700">
        The page could not be shown. If the database is restarting, this clears up by itself in a moment.
      </p>
      <button type="button" onClick={retry} className="mt-4 rounded bg-copper-600 px-3 py-1.5 text-sm font-medium text-white hover:bg-copper-700">
        Try again
      </button>
    </main>
  );
}
