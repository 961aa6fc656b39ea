"use client";

import { useState } from "react";
import { Button } from "./button";

/** Copies `text` to the clipboard and says so; where the browser refuses, it says to select and copy by hand. */
export function CopyButton({ text, label = "Copy" }: { text: string; label?: string }) {
  const [state, setState] = useState<"idle" | "copied" | "failed">("idle");
  return (
    <span className="inline-flex items-center gap-2">
      <Button
        variant="secondary"
        onClick={() => {
          navigator.clipboard.writeText(text).then(
            () => setState("copied"),
            () => setState("failed"),
          );
        }}
      >
        {label}
      </Button>
      <span role="status" className="text-xs text-ink-700">
        {state === "copied" ? "Copied to the clipboard." : state === "failed" ? "The browser did not allow copying; select the text and copy it." : ""}
      </span>
    </span>
  );
}
