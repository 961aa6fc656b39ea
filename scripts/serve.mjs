#!/usr/bin/env node
// Serves a production build with graceful shutdown: on SIGTERM or SIGINT the server stops
// taking new connections, lets requests in flight finish, closes the database pool, exits.
import http from "node:http";
import path from "node:path";
import { fileURLToPath } from "node:url";
import next from "next";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
const hostname = process.env.HOST || "127.0.0.1";
const port = Number(process.env.PORT || 3000);
const graceMs = Number(process.env.SHUTDOWN_GRACE_MS || 15000);

const app = next({ dev: false, dir: root, hostname, port });
await app.prepare();
const handle = app.getRequestHandler();

let stopping = false;
const server = http.createServer((req, res) => {
  if (stopping) res.setHeader("connection", "close");
  void handle(req, res);
});
server.keepAliveTimeout = 5000;
server.listen(port, hostname, () => {
  console.log(JSON.stringify({ level: 30, msg: "listening", url: `http://${hostname}:${port}` }));
});

async function shutdown(signal) {
  if (stopping) return;
  stopping = true;
  console.log(JSON.stringify({ level: 30, msg: "shutting down", signal }));
  const force = setTimeout(() => {
    console.error(JSON.stringify({ level: 50, msg: "requests still running after grace period; exiting" }));
    process.exit(1);
  }, graceMs);
  force.unref();
  server.close(async () => {
    // The app keeps its pool on globalThis (db/client.ts); close it so PostgreSQL sees a clean exit.
    // Hooks first: unsent rate-limit counts, the LISTEN connection (db/client.ts beforeCloseDb).
    for (const hook of globalThis.loopkeeperCloseHooks ?? []) await hook().catch(() => undefined);
    await globalThis.loopkeeperPool?.end().catch(() => undefined);
    console.log(JSON.stringify({ level: 30, msg: "stopped" }));
    process.exit(0);
  });
  server.closeIdleConnections();
}
process.on("SIGTERM", () => void shutdown("SIGTERM"));
process.on("SIGINT", () => void shutdown("SIGINT"));
