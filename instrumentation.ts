/** Runs once per server process: the outbox poller lives on the Node runtime only. */
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs" || process.env.LOOPKEEPER_MAIL_POLL === "off") return;
  const { startMailPolling } = await import("./lib/platform/mail/sender");
  startMailPolling();
}
