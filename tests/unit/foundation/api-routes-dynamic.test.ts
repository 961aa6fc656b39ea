import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { ROOT, sourceFiles } from "./source-tree";

// Every API answer depends on who asks (session or token) or on the moment (health, budgets), so
// each route module declares itself dynamic: Next.js then never tries to prerender it at build
// time and does not wrap each request for static-generation tracking.
describe("API route modules", () => {
  const routes = sourceFiles("app/api").filter((f) => path.basename(f) === "route.ts");

  it("are found", () => {
    expect(routes.length).toBeGreaterThan(40);
  });

  it("each declare dynamic = \"force-dynamic\"", () => {
    const missing = routes.filter((f) => !/^export const dynamic = "force-dynamic";$/m.test(fs.readFileSync(path.join(ROOT, f), "utf8")));
    expect(missing, "add export const dynamic = \"force-dynamic\"; to these route modules").toEqual([]);
  });
});
