import net from "node:net";
import { describe, expect, it } from "vitest";
import { s3Storage } from "@/lib/platform/storage";
import { AppError } from "@/lib/api/errors";

/** A loopback port with nothing listening: the fake S3 server is "down". */
async function closedPort(): Promise<number> {
  const srv = net.createServer();
  await new Promise<void>((r) => srv.listen(0, "127.0.0.1", r));
  const { port } = srv.address() as net.AddressInfo;
  await new Promise<void>((r) => srv.close(() => r()));
  return port;
}

describe("object storage unreachable", () => {
  it("an upload fails with a clear 503 and keeps nothing", async () => {
    const port = await closedPort();
    const storage = s3Storage({ endpoint: `http://127.0.0.1:${port}`, bucket: "down", region: "us-east-1", accessKeyId: "S3RVER", secretAccessKey: "S3RVER" });
    const started = performance.now();
    const body = (async function* () {
      yield new Uint8Array(1024);
    })();
    const err = await storage.put(body, { maxBytes: 4096 }).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(AppError);
    expect((err as AppError).status).toBe(503);
    expect((err as AppError).message).toMatch(/File storage is not reachable.*nothing was saved/);
    expect(performance.now() - started).toBeLessThan(15_000);
    await expect(storage.get("6f1c2a7e-3b4d-4c5e-8f90-1a2b3c4d5e6f")).rejects.toMatchObject({ code: "unavailable" });
  }, 30_000);
});
