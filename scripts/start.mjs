#!/usr/bin/env node
// `npm start`: prepare everything, build when the sources changed, start the local fakes
// and serve the app on http://127.0.0.1:3000.
import { spawn } from "node:child_process";
import fs from "node:fs";
import path from "node:path";
import { log } from "./log.mjs";
import { prepare, root, run } from "./prepare.mjs";

const port = Number(process.env.PORT || 3000);
const env = await prepare({ port });
const distDir = process.env.NEXT_DIST_DIR || ".next";

if (process.env.LOOPKEEPER_SKIP_BUILD !== "1" || !fs.existsSync(path.join(root, distDir, "BUILD_ID"))) {
  run("npx", ["next", "build"], { ...env, NODE_ENV: "production" }, "Building the app (next build)…");
}

// Loaded only now: it needs packages that prepare() installs on a fresh machine.
const { startFakes } = await import("./fakes.mjs");
const fakes = await startFakes(env);
log(`Serving Loopkeeper on http://127.0.0.1:${port} — demo accounts are listed in README.md.`);
const server = spawn(process.execPath, [path.join(root, "scripts", "serve.mjs")], {
  cwd: root,
  stdio: "inherit",
  env: { ...env, ...fakes.env, NODE_ENV: "production", PORT: String(port), HOST: "127.0.0.1" },
});

function stop(signal) {
  server.kill(signal);
  void fakes.stop();
}
process.on("SIGINT", () => stop("SIGINT"));
process.on("SIGTERM", () => stop("SIGTERM"));
server.on("exit", (code) => {
  void fakes.stop().finally(() => process.exit(code ?? 0));
});
