#!/usr/bin/env node
// Launcher: runs the TypeScript CLI through tsx's loaders, so no build step is needed.
import { register as registerCjs } from "tsx/cjs/api";
import { register as registerEsm } from "tsx/esm/api";

registerCjs();
registerEsm();
await import(new URL("../cli/index.ts", import.meta.url).href);
