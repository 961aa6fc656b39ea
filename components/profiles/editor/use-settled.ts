"use client";

import { useEffect, useState } from "react";

/**
 * `value` once it has stayed the same for `ms`: parts of the editor that need not follow every
 * keystroke or drag step (the load sweep chart, the publish form's version suggestion) catch up
 * when the editing pauses, and are left alone while it goes on.
 */
export function useSettled<T>(value: T, ms: number): T {
  const [settled, setSettled] = useState(value);
  useEffect(() => {
    if (Object.is(settled, value)) return;
    const timer = setTimeout(() => setSettled(value), ms);
    return () => clearTimeout(timer);
  }, [value, settled, ms]);
  return settled;
}
