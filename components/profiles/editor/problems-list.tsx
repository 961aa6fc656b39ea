"use client";

import type { ValidationIssue } from "@/lib/engine";

/** The engine's issues; clicking one moves the editor to it. */
export function ProblemsList({ issues, onJump }: { issues: ValidationIssue[]; onJump: (line: number, column: number) => void }) {
  const errors = issues.filter((i) => i.severity === "error").length;
  return (
    <section aria-labelledby="problems-title" className="rounded-md bg-white shadow-panel">
      <h2 id="problems-title" className="border-b border-ink-200 px-4 py-2.5 text-base font-semibold text-ink-900">
        Problems <span className="text-sm font-normal text-ink-600">({errors} errors, {issues.length - errors} warnings)</span>
      </h2>
      {issues.length === 0 ? (
        <p className="px-4 py-3 text-sm text-signal-ok" role="status">No problems for the chosen hardware.</p>
      ) : (
        <ul className="max-h-56 divide-y divide-ink-100 overflow-y-auto" data-testid="problems">
          {issues.map((issue, i) => {
            const at = issue.range?.start;
            return (
              <li key={`${issue.code}-${issue.path}-${i}`}>
                <button
                  type="button"
                  className="flex w-full gap-2 px-4 py-2 text-left text-sm hover:bg-ink-50 focus:bg-ink-50 focus:outline-none"
                  onClick={() => onJump(at?.line ?? 1, at?.column ?? 1)}
                >
                  <span className={`shrink-0 font-semibold ${issue.severity === "error" ? "text-signal-fault" : "text-signal-warn"}`}>{issue.severity === "error" ? "Error" : "Warning"}</span>
                  <span className="shrink-0 tabular-nums text-ink-600">{at ? `${at.line}:${at.column}` : "—"}</span>
                  <span className="text-ink-900">{issue.message}</span>
                  <code className="ml-auto shrink-0 text-xs text-ink-500">{issue.code}</code>
                </button>
              </li>
            );
          })}
        </ul>
      )}
    </section>
  );
}
