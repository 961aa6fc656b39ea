/**
 * A size as people read it: bytes below 1 KiB, then KiB and MiB with one decimal
 * (binary prefixes, IEC 80000-13:2008: 1 KiB = 1,024 B, 1 MiB = 1,048,576 B).
 */
export function formatBytes(bytes: number): string {
  if (!Number.isFinite(bytes) || bytes < 0) return "—";
  if (bytes < 1024) return `${bytes.toLocaleString("en")} B`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toLocaleString("en", { maximumFractionDigits: 1, minimumFractionDigits: 1 })} KiB`;
  return `${(bytes / 1024 / 1024).toLocaleString("en", { maximumFractionDigits: 1, minimumFractionDigits: 1 })} MiB`;
}
