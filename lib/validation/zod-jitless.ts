import { z } from "zod";

// Zod compiles object parsers with `new Function` where eval is allowed, and first probes
// whether it is; the screens' Content-Security-Policy forbids eval and the browser reports the
// probe as a violation. Screens therefore parse without the compiler: instrumentation-client.ts imports this module
// before any screen's code builds a schema (zod decides when a schema is made, not when it parses).
z.config({ jitless: true });
