"use client";

import type { ReactNode } from "react";
import { Button } from "@/components/ui/button";
import { formText } from "@/components/ui/form-data";

/** A small filter form; submitting writes the named fields into the URL and goes back to page 1. */
export function FilterBar({ fields, onApply, children }: { fields: string[]; onApply: (values: Record<string, string>) => void; children: ReactNode }) {
  return (
    <form
      role="search"
      className="mb-4 flex flex-wrap items-end gap-3"
      onSubmit={(e) => {
        e.preventDefault();
        const fd = new FormData(e.currentTarget);
        onApply({ ...Object.fromEntries(fields.map((f) => [f, formText(fd, f)])), page: "" });
      }}
    >
      {children}
      <Button type="submit" variant="secondary">
        Filter
      </Button>
    </form>
  );
}
