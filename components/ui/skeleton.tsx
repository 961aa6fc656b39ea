import { SkeletonRows, Table } from "./table";

/**
 * What a section shows while its page is being loaded on the server (a `loading.tsx`): the
 * page's outline in grey, never a spinner, so the layout does not jump when the data arrives.
 */
export function PageSkeleton({ title, kind = "table" }: { title: string; kind?: "table" | "columns" | "detail" | "form" }) {
  return (
    <div aria-busy="true" aria-live="polite" data-testid="page-skeleton">
      <p className="sr-only">Loading {title}…</p>
      <div className="mb-5 space-y-2" aria-hidden>
        <div className="h-7 w-48 animate-pulse rounded bg-ink-200" />
        <div className="h-4 w-80 animate-pulse rounded bg-ink-100" />
      </div>
      {kind === "table" && (
        <section className="rounded-md bg-white p-4 shadow-panel" aria-hidden>
          <div className="mb-4 h-8 w-72 animate-pulse rounded bg-ink-100" />
          <Table>
            <tbody>
              <SkeletonRows cols={5} rows={8} />
            </tbody>
          </Table>
        </section>
      )}
      {kind === "columns" && (
        <div className="grid gap-3 md:grid-cols-3 xl:grid-cols-6" aria-hidden>
          {Array.from({ length: 6 }, (_, i) => (
            <div key={i} className="space-y-2 rounded-md bg-ink-50 p-2">
              <div className="h-4 w-20 animate-pulse rounded bg-ink-200" />
              <div className="h-16 animate-pulse rounded bg-white shadow-panel" />
              <div className="h-16 animate-pulse rounded bg-white shadow-panel" />
            </div>
          ))}
        </div>
      )}
      {kind === "detail" && (
        <div className="grid gap-4 lg:grid-cols-3" aria-hidden>
          <div className="h-72 animate-pulse rounded-md bg-white shadow-panel lg:col-span-2" />
          <div className="h-72 animate-pulse rounded-md bg-white shadow-panel" />
        </div>
      )}
      {kind === "form" && <div className="h-64 max-w-3xl animate-pulse rounded-md bg-white shadow-panel" aria-hidden />}
    </div>
  );
}
