import Link from "next/link";

export default function Forbidden() {
  return (
    <main className="mx-auto max-w-lg px-6 py-20">
      <h1>Not for your role</h1>
      <p className="mt-2 text-ink-700">
        Your account is signed in, but its role does not include this page. Ask an administrator if you need access.
      </p>
      <p className="mt-4">
        <Link href="/">Back to the dashboard</Link>
      </p>
    </main>
  );
}
