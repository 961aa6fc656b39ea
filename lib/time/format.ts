/**
 * Times as every screen writes them: ISO 8601 date and time in UTC with the zone named,
 * "2026-12-02 08:53 UTC". The server stores and sends UTC; the zone is written out so a
 * reader in another zone does not take it for local time.
 */
export function formatUtc(at: string | Date, precision: "minute" | "second" = "minute"): string {
  const d = typeof at === "string" ? new Date(at) : at;
  if (Number.isNaN(d.getTime())) return "—";
  return `${d.toISOString().slice(0, precision === "minute" ? 16 : 19).replace("T", " ")} UTC`;
}
