#!/usr/bin/env node
// `npm run dev`: the usual Next dev server, with the database and secrets prepared.
import { spawn } from "node:child_process";
import path from "node:path";
import { prepare, root } from "./prepare.mjs";

const port = Number(process.env.PORT || 3000);
const env = await prepare({ port });
// Loaded only now: it needs packages that prepare() installs on a fresh machine.
const { startFakes } = await import("./fakes.mjs");
const fakes = await startFakes(env);
const child = spawn(path.join(root, "node_modules", ".bin", "next"), ["dev", "-H", "127.0.0.1", "-p", String(port)], {
  cwd: root,
  stdio: "inherit",
  env: { ...env, ...fakes.env },
});
for (const sig of ["SIGINT", "SIGTERM"]) process.on(sig, () => child.kill(sig));
child.on("exit", (code) => void fakes.stop().finally(() => process.exit(code ?? 0)));
