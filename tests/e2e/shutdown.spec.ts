import { spawn } from "node:child_process";
import http from "node:http";
import { expect, test } from "@playwright/test";
import { ACCOUNTS, signInRequest } from "./support/accounts";

const port = Number(process.env.E2E_PORT || 3100) + 50;

function waitForHealth(timeoutMs: number): Promise<void> {
  const started = Date.now();
  return new Promise((resolve, reject) => {
    const tryOnce = () => {
      http
        .get(`http://127.0.0.1:${port}/api/health`, (res) => {
          res.resume();
          if (res.statusCode === 200) resolve();
          else retry();
        })
        .on("error", retry);
    };
    const retry = () => (Date.now() - started > timeoutMs ? reject(new Error("server did not start")) : setTimeout(tryOnce, 250));
    tryOnce();
  });
}

test("SIGTERM: stops taking requests, finishes the one in flight, exits cleanly", async ({ request }) => {
  test.setTimeout(90_000);
  await signInRequest(request, ACCOUNTS.viewer);
  const { secret } = (await (await request.post("/api/v1/tokens", { data: { name: "shutdown test", expiresInDays: 1 } })).json()) as { secret: string };

  const server = spawn(process.execPath, ["scripts/serve.mjs"], { env: { ...process.env, PORT: String(port), HOST: "127.0.0.1", NODE_ENV: "production" }, stdio: "pipe" });
  const exited = new Promise<number | null>((resolve) => server.on("exit", (code) => resolve(code)));
  await waitForHealth(60_000);

  // A request whose body arrives slowly is in flight when the signal comes.
  const inFlight = new Promise<{ status: number; body: string }>((resolve, reject) => {
    const req = http.request(
      { host: "127.0.0.1", port, method: "POST", path: "/api/v1/tokens", headers: { authorization: `Bearer ${secret}`, "content-type": "application/json" } },
      (res) => {
        let body = "";
        res.on("data", (c: Buffer) => (body += c.toString()));
        res.on("end", () => resolve({ status: res.statusCode ?? 0, body }));
      },
    );
    req.on("error", reject);
    req.write('{"name": "created while stopping",');
    setTimeout(() => {
      server.kill("SIGTERM");
      setTimeout(() => req.end('"expiresInDays": 1}'), 1000);
    }, 300);
  });

  const finished = await inFlight;
  expect(finished.status).toBe(201);
  expect(finished.body).toContain("created while stopping");
  expect(await exited).toBe(0);
  // And nothing listens any more.
  await expect(waitForHealth(1000)).rejects.toThrow();
});
