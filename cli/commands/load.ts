import { validateHardwareText, validateProfileText, type CoolingProfile, type HardwareContext, type ValidationIssue } from "../../lib/engine";
import { readText } from "../io";

export interface Loaded<T> {
  file: string;
  value?: T;
  issues: ValidationIssue[];
  ok: boolean;
}

/** Reads and validates a hardware context file. */
export function loadHardware(file: string): Loaded<HardwareContext> {
  const r = validateHardwareText(readText(file));
  return { file, value: r.ok ? r.value : undefined, issues: r.issues, ok: r.ok };
}

/** Reads and validates a profile file, with the hardware's limits when given. */
export function loadProfile(file: string, hw?: HardwareContext): Loaded<CoolingProfile> {
  const r = validateProfileText(readText(file), hw);
  return { file, value: r.ok ? r.value : undefined, issues: r.issues, ok: r.ok };
}
