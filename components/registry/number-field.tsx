import type { UseFormRegisterReturn } from "react-hook-form";
import { Field, Input, describedBy } from "@/components/ui/field";

/** A labelled number input registered with react-hook-form, with its hint and field-level error. */
export function NumberField({ id, label, hint, error, reg, step = "any" }: { id: string; label: string; hint?: string; error?: string; reg: UseFormRegisterReturn; step?: string }) {
  return (
    <Field id={id} label={label} hint={hint} error={error}>
      <Input type="number" inputMode="decimal" step={step} {...describedBy(id, error)} {...reg} />
    </Field>
  );
}
