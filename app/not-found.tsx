import Link from "next/link";

export default function NotFound() {
  return (
    <main className="mx-auto max-w-lg px-6 py-20">
      <h1>Nothing here</h1>
      <p className="mt-2 text-ink-700">This page does not exist, or the record it names was never registered.</p>
      <p className="mt-4">
        <Link href="/">Back to the dashboard</Link>
      </p>
    </main>
  );
}
