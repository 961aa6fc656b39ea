"use client";

import { useId, useRef, type ReactNode } from "react";
import { Button, type ButtonVariant } from "./button";

/**
 * A button for what cannot be undone: it opens a modal dialog that names what will happen and
 * to what; only the dialog's own button does it. Escape or Cancel closes it with nothing done.
 */
export function ConfirmButton({
  label,
  title,
  children,
  confirmLabel,
  onConfirm,
  variant = "secondary",
  disabled,
  className,
}: {
  label: ReactNode;
  title: string;
  children: ReactNode;
  confirmLabel: string;
  onConfirm: () => void;
  variant?: ButtonVariant;
  disabled?: boolean;
  className?: string;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  const bodyId = useId();
  return (
    <>
      <Button variant={variant} disabled={disabled} className={className} onClick={() => ref.current?.showModal()}>
        {label}
      </Button>
      <dialog ref={ref} aria-labelledby={titleId} aria-describedby={bodyId} className="m-auto max-w-md rounded-lg p-0 shadow-xl backdrop:bg-ink-900/40">
        <div className="space-y-3 p-5">
          <h2 id={titleId} className="text-base font-semibold text-ink-900">{title}</h2>
          <div id={bodyId} className="text-sm text-ink-700">{children}</div>
          <div className="flex justify-end gap-2 pt-2">
            <Button variant="secondary" autoFocus onClick={() => ref.current?.close()}>Cancel</Button>
            <Button
              variant="danger"
              onClick={() => {
                ref.current?.close();
                onConfirm();
              }}
            >
              {confirmLabel}
            </Button>
          </div>
        </div>
      </dialog>
    </>
  );
}
