/**
 * A 32-bit address or word as the app writes it everywhere: "0x" and eight upper-case hex
 * digits (0x0800F000), the width of the ARM Cortex-M address space the boards use.
 */
export function hex32(value: number): string {
  return `0x${(value >>> 0).toString(16).toUpperCase().padStart(8, "0")}`;
}
