"use client";

import { useEffect, useId, useRef, type ReactNode } from "react";
import { Button, type ButtonVariant } from "./button";

/**
 * A modal confirmation for an action that cannot be taken back. Built on the native
 * `<dialog>` opened with `showModal()`, so the browser keeps focus inside it, closes it on
 * Escape, hides the page behind it from assistive technology and returns focus to the
 * control that opened it. The title says what will happen, the description to what.
 */
export function ConfirmDialog({
  open,
  title,
  description,
  confirmLabel,
  variant = "danger",
  pending = false,
  confirmDisabled = false,
  onConfirm,
  onClose,
  children,
}: {
  open: boolean;
  title: string;
  description: ReactNode;
  confirmLabel: string;
  variant?: ButtonVariant;
  pending?: boolean;
  confirmDisabled?: boolean;
  onConfirm: () => void;
  onClose: () => void;
  /** Fields the action needs (a reason, release notes) and the server's refusal, if any. */
  children?: ReactNode;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  const descriptionId = useId();

  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal();
    if (!open && dialog.open) dialog.close();
  }, [open]);

  return (
    <dialog
      ref={ref}
      aria-labelledby={titleId}
      aria-describedby={descriptionId}
      className="w-[min(32rem,calc(100vw-2rem))] rounded-md bg-white p-0 text-ink-900 shadow-panel backdrop:bg-ink-900/40"
      // Escape or the browser closing it: keep React's state in step.
      onCancel={(e) => {
        e.preventDefault();
        if (!pending) onClose();
      }}
    >
      {open && (
        <form
          className="space-y-3 p-5"
          onSubmit={(e) => {
            e.preventDefault();
            onConfirm();
          }}
        >
          <h2 id={titleId} className="text-lg font-semibold">
            {title}
          </h2>
          <div id={descriptionId} className="space-y-2 text-sm text-ink-700">
            {description}
          </div>
          {children}
          <div className="flex justify-end gap-2 pt-2">
            <Button variant="secondary" onClick={onClose} disabled={pending}>
              Cancel
            </Button>
            <Button type="submit" variant={variant} disabled={pending || confirmDisabled}>
              {confirmLabel}
            </Button>
          </div>
        </form>
      )}
    </dialog>
  );
}
