"use client";

import { useRef, useState } from "react";
import { buttonClass, Button } from "./button";
import { formatBytes } from "@/lib/units/bytes";

/**
 * The app's file input: a drop zone with a "Choose file" button, then the chosen file's name
 * and size with Remove. The real <input type="file"> stays in the page (visually hidden, still
 * focusable and labelled by the Field around it), so keyboards, screen readers and tests use it.
 */
export function FilePicker({
  id,
  accept,
  file,
  onFile,
  disabled,
  invalid,
  describedBy,
  chooseLabel = "Choose file",
}: {
  id: string;
  accept: string;
  file: File | null;
  onFile: (file: File | null) => void;
  disabled?: boolean;
  invalid?: boolean;
  describedBy?: string;
  chooseLabel?: string;
}) {
  const input = useRef<HTMLInputElement>(null);
  const [over, setOver] = useState(false);
  const choose = (f: File | null) => {
    onFile(f);
    // The same file chosen again after Remove must fire change again.
    if (input.current) input.current.value = "";
  };
  return (
    <div
      data-testid={`${id}-picker`}
      className={`flex flex-wrap items-center gap-3 rounded-md border-2 border-dashed px-3 py-2.5 ${over ? "border-copper-500 bg-copper-50" : invalid ? "border-signal-fault" : "border-ink-300 bg-white"} ${disabled ? "opacity-60" : ""}`}
      onDragOver={(e) => {
        if (disabled) return;
        e.preventDefault();
        setOver(true);
      }}
      onDragLeave={() => setOver(false)}
      onDrop={(e) => {
        e.preventDefault();
        setOver(false);
        if (!disabled) choose(e.dataTransfer.files[0] ?? null);
      }}
    >
      <input
        ref={input}
        id={id}
        type="file"
        accept={accept}
        className="peer sr-only"
        disabled={disabled}
        aria-invalid={invalid ? true : undefined}
        aria-describedby={describedBy}
        onChange={(e) => choose(e.target.files?.[0] ?? null)}
      />
      {/* For the pointer only: the input itself takes keyboard focus and carries the Field's label. */}
      <button
        type="button"
        tabIndex={-1}
        aria-hidden
        disabled={disabled}
        onClick={() => input.current?.click()}
        className={buttonClass("secondary", "peer-focus-visible:ring-2 peer-focus-visible:ring-copper-400")}
      >
        {file ? "Choose another" : chooseLabel}
      </button>
      {file ? (
        <span className="flex min-w-0 flex-1 items-center gap-2 text-sm" data-testid={`${id}-chosen`}>
          <span className="truncate font-medium text-ink-900">{file.name}</span>
          <span className="whitespace-nowrap tabular-nums text-ink-600">{formatBytes(file.size)}</span>
          <Button variant="quiet" className="ml-auto" disabled={disabled} onClick={() => choose(null)} aria-label={`Remove ${file.name}`}>
            Remove
          </Button>
        </span>
      ) : (
        <span className="text-sm text-ink-600">or drop it here</span>
      )}
    </div>
  );
}
