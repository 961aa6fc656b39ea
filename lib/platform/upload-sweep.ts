import "server-only";
import { logger } from "./log";
import { removeUnusedUploads } from "@/lib/use-cases/builds/uploads";

const EVERY_MS = 60 * 60 * 1000;

/**
 * Removes uploads no build uses once they are old enough, shortly after start and then hourly.
 * Several instances may sweep at once: each deletion happens once in PostgreSQL.
 */
export function startUploadSweep(): void {
  const sweep = () => {
    removeUnusedUploads()
      .then((n) => {
        if (n > 0) logger.info({ removed: n }, "unused uploads removed");
      })
      .catch((err: unknown) => logger.warn({ err: err instanceof Error ? err.message : String(err) }, "upload sweep failed; it runs again in an hour"));
  };
  setTimeout(sweep, 30_000).unref();
  setInterval(sweep, EVERY_MS).unref();
}
