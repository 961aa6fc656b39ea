// Runs in the browser before any screen's code. Zod compiles object parsers with `new Function`
// where eval is allowed, and first probes whether it is; the screens' Content-Security-Policy
// forbids eval and the browser reports the probe as a violation. Screens therefore parse without
// the compiler, from the first schema on (zod decides when a schema is made, not when it parses).
// Zod keeps its settings in the object at `globalThis.__zod_globalConfig` and adopts one that is
// already there, so this sets `jitless` without loading zod: pages whose code needs no schema
// do not download it (forms load theirs when they first validate).
const zodGlobal = globalThis as { __zod_globalConfig?: { jitless?: boolean } };
(zodGlobal.__zod_globalConfig ??= {}).jitless = true;
export {};
