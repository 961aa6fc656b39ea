/**
 * The instants an audit date filter stands for. A bare day (YYYY-MM-DD) is a whole UTC day:
 * "from" its first millisecond, "to" its last, so a range of one day includes that day's events.
 */
export function auditRangeBound(value: string | undefined, end: "from" | "to"): Date | undefined {
  if (!value) return undefined;
  if (/^\d{4}-\d{2}-\d{2}$/.test(value)) return new Date(`${value}T${end === "from" ? "00:00:00.000" : "23:59:59.999"}Z`);
  return new Date(value);
}
