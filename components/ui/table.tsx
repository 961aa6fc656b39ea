import type { ReactNode } from "react";
import { ErrorNotice } from "./error-notice";

/**
 * Dense, readable table chrome; columns and rows come from the caller. The wrapper scrolls
 * sideways on narrow screens, so it takes keyboard focus (arrow keys scroll it).
 */
export function Table({ children, caption }: { children: ReactNode; caption?: string }) {
  return (
    <div className="overflow-x-auto" tabIndex={0} {...(caption ? { role: "region", "aria-label": caption } : {})}>
      <table className="w-full border-collapse text-left text-sm">
        {caption && <caption className="sr-only">{caption}</caption>}
        {children}
      </table>
    </div>
  );
}

export function Th({ children, className = "" }: { children?: ReactNode; className?: string }) {
  return <th scope="col" className={`border-b border-ink-300 bg-ink-50 px-3 py-2 text-xs font-semibold uppercase tracking-wide text-ink-600 ${className}`}>{children}</th>;
}

export function Td({ children, className = "" }: { children?: ReactNode; className?: string }) {
  return <td className={`border-b border-ink-100 px-3 py-2 align-top ${className}`}>{children}</td>;
}

export function EmptyRow({ colSpan, children }: { colSpan: number; children: ReactNode }) {
  return (
    <tr>
      <td colSpan={colSpan} className="px-3 py-6 text-center text-sm text-ink-500">
        {children}
      </td>
    </tr>
  );
}

/** A list that could not be loaded: the one error notice, across the whole row, with Retry. */
export function ErrorRow({ colSpan, error, onRetry }: { colSpan: number; error: unknown; onRetry: () => void }) {
  return (
    <tr>
      <td colSpan={colSpan} className="px-3 py-3">
        <ErrorNotice error={error} onRetry={onRetry} />
      </td>
    </tr>
  );
}

export function SkeletonRows({ rows = 5, cols }: { rows?: number; cols: number }) {
  return (
    <>
      {Array.from({ length: rows }, (_, r) => (
        <tr key={r} aria-hidden>
          {Array.from({ length: cols }, (_, c) => (
            <td key={c} className="border-b border-ink-100 px-3 py-2.5">
              <div className="h-3 animate-pulse rounded bg-ink-100" />
            </td>
          ))}
        </tr>
      ))}
    </>
  );
}
