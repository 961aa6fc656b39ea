// Runs in the browser before any screen's code: zod must parse without its compiler there
// (see lib/validation/zod-jitless.ts) from the first schema on.
import "./lib/validation/zod-jitless";
