/** Runs once per server process, on the Node runtime only: the outbox poller and the upload sweep. */
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  if (process.env.LOOPKEEPER_MAIL_POLL !== "off") {
    const { startMailPolling } = await import("./lib/platform/mail/sender");
    startMailPolling();
  }
  if (process.env.LOOPKEEPER_UPLOAD_SWEEP !== "off") {
    const { startUploadSweep } = await import("./lib/platform/upload-sweep");
    startUploadSweep();
  }
}
