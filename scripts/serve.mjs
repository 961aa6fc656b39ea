#!/usr/bin/env node
// Serves a production build with graceful shutdown: on SIGTERM or SIGINT the server stops
// taking new connections, lets requests in flight finish, closes the database pool, exits.
import { AsyncLocalStorage } from "node:async_hooks";
import fs from "node:fs";
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
// Diagnostics: with LOOPKEEPER_REQUEST_STATS=<file>, each request runs with a counter the app
// fills (statements, session lookups; db/request-stats.ts, same store through globalThis) and
// one JSON line per request goes to that file when the answer is complete.
const statsFile = process.env.LOOPKEEPER_REQUEST_STATS;
const statsStorage = statsFile ? (globalThis[Symbol.for("loopkeeper.requestStats")] ??= new AsyncLocalStorage()) : undefined;

const server = http.createServer((req, res) => {
  if (stopping) res.setHeader("connection", "close");
  if (!statsStorage) return void handle(req, res);
  const stats = { queries: 0, sessionLookups: 0, actorQueries: 0 };
  res.on("finish", () => {
    const line = { requestId: req.headers["x-request-id"] ?? null, method: req.method, path: req.url, status: res.statusCode, ...stats };
    fs.appendFile(statsFile, JSON.stringify(line) + "\n", () => undefined);
  });
  statsStorage.run(stats, () => void handle(req, res));
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
