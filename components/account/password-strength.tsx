"use client";

import { useEffect, useState } from "react";

const LABELS = ["very weak", "weak", "fair", "strong", "very strong"] as const;

/**
 * A strength estimate from zxcvbn-ts (pattern matching against common passwords, names,
 * keyboard walks and dates). Loaded only when someone types a new password, so the word
 * lists never weigh on other screens. The server's rules decide; this only guides.
 */
export function PasswordStrength({ password, userInputs }: { password: string; userInputs: string[] }) {
  const [estimate, setEstimate] = useState<{ password: string; score: number; warning: string } | null>(null);
  useEffect(() => {
    let live = true;
    if (!password) return;
    void (async () => {
      const [{ zxcvbn, zxcvbnOptions }, common] = await Promise.all([import("@zxcvbn-ts/core"), import("@zxcvbn-ts/language-common")]);
      zxcvbnOptions.setOptions({ dictionary: common.dictionary, graphs: common.adjacencyGraphs });
      const r = zxcvbn(password, userInputs);
      if (live) setEstimate({ password, score: r.score, warning: r.feedback.warning ?? "" });
    })();
    return () => {
      live = false;
    };
  }, [password, userInputs]);
  // An estimate for an earlier value is not shown while the new one is computed.
  const result = estimate && estimate.password === password ? estimate : null;
  if (!result) return null;
  const pct = ((result.score + 1) / 5) * 100;
  return (
    <div className="space-y-1" data-testid="password-strength">
      <div className="h-1.5 w-full rounded bg-ink-200" role="meter" aria-label="Password strength" aria-valuemin={0} aria-valuemax={4} aria-valuenow={result.score} aria-valuetext={LABELS[result.score]}>
        <div className={`h-1.5 rounded ${result.score >= 3 ? "bg-signal-ok" : result.score === 2 ? "bg-signal-warn" : "bg-signal-fault"}`} style={{ width: `${pct}%` }} />
      </div>
      <p className="text-xs text-ink-600">
        Estimated strength: {LABELS[result.score]}
        {result.warning ? ` — ${result.warning}` : ""}
      </p>
    </div>
  );
}
