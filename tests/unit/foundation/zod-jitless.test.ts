import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";

/**
 * The screens' policy forbids eval, and zod probes for it (a reported violation) unless told to
 * parse without its compiler before its first schema. instrumentation-client.ts runs before any
 * screen code and must do that without loading zod into every page.
 */
describe("zod without its compiler in the browser", () => {
  it("instrumentation-client.ts sets zod's jitless setting, which zod then reports", async () => {
    await import("@/instrumentation-client");
    const { z } = await import("zod");
    expect(z.config().jitless).toBe(true);
  });

  it("instrumentation-client.ts does not import zod", () => {
    const text = readFileSync("instrumentation-client.ts", "utf8");
    expect(text).not.toMatch(/from\s+["']zod|import\s*\(\s*["']zod|import\s+["'][^"']*zod/);
  });
});
