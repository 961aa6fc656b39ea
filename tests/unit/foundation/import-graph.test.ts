import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { ROOT, resolveLocal as resolveIn, sourceFiles } from "./source-tree";

/**
 * The layering read from the source itself: db/ is storage that nothing it imports may reach
 * back into, and lib/<domain> stays pure (no React, Next or database) so it runs anywhere.
 */
const SOURCE_DIRS = ["app", "components", "db", "lib", "cli"];
const EXTENSIONS = [".ts", ".tsx", "/index.ts", "/index.tsx"];


function specifiers(file: string): string[] {
  const text = fs.readFileSync(path.join(ROOT, file), "utf8");
  const out: string[] = [];
  for (const m of text.matchAll(/(?:^|\n)\s*(?:import|export)\s[^;]*?from\s+["']([^"']+)["']/g)) out.push(m[1]!);
  for (const m of text.matchAll(/\bimport\(\s*["']([^"']+)["']\s*\)/g)) out.push(m[1]!);
  for (const m of text.matchAll(/(?:^|\n)\s*import\s+["']([^"']+)["']/g)) out.push(m[1]!);
  return out;
}


const resolveLocal = (from: string, spec: string) => resolveIn(from, spec, ["", ...EXTENSIONS]);
const files = SOURCE_DIRS.flatMap(sourceFiles);
const graph = new Map(files.map((f) => [f, specifiers(f).map((s) => ({ spec: s, file: resolveLocal(f, s) }))]));
const isDb = (f: string) => f.startsWith(`db${path.sep}`);

/** Every local file reachable from `start`, with the path that reaches it. */
function reachable(start: string): Map<string, string[]> {
  const seen = new Map<string, string[]>([[start, [start]]]);
  const queue = [start];
  while (queue.length) {
    const cur = queue.shift()!;
    for (const { file } of graph.get(cur) ?? []) {
      if (!file || seen.has(file)) continue;
      seen.set(file, [...seen.get(cur)!, file]);
      queue.push(file);
    }
  }
  return seen;
}

describe("import graph", () => {
  it("reads a realistic graph (guards against a parser that finds nothing)", () => {
    expect(files.length).toBeGreaterThan(100);
    expect(graph.get(path.join("db", "builds.ts"))?.some((i) => i.file === path.join("db", "schema.ts"))).toBe(true);
  });

  it("no module that db/ imports reaches back into db/", () => {
    const cycles: string[] = [];
    for (const file of files.filter(isDb)) {
      for (const { file: target } of graph.get(file) ?? []) {
        if (!target || isDb(target)) continue;
        for (const [reached, via] of reachable(target)) {
          if (isDb(reached)) cycles.push(`${file} → ${via.join(" → ")}`);
        }
      }
    }
    expect(cycles).toEqual([]);
  });

  it("db/ answers in storage terms: it never imports the API's error type (use cases decide what a refusal means to a person)", () => {
    const apiErrors = path.join("lib", "api", "errors.ts");
    const offenders = files.filter(isDb).filter((f) => (graph.get(f) ?? []).some((i) => i.file === apiErrors || /AppError/.test(i.spec)));
    expect(files.filter(isDb).length).toBeGreaterThan(20);
    expect(offenders).toEqual([]);
  });

  it("lib/<domain> imports no React, Next or database code (lib/platform and lib/use-cases are the server side)", () => {
    const forbidden = /^(react|react-dom|next|next-auth|pg|drizzle-orm|@tanstack\/react-query)(\/|$)|^@\/(db|components|app)\/|^@\/lib\/(platform|use-cases)\//;
    const offenders: string[] = [];
    for (const file of files.filter((f) => f.startsWith(`lib${path.sep}`) && !/^lib[\\/](platform|use-cases)[\\/]/.test(f))) {
      for (const { spec, file: target } of graph.get(file) ?? []) {
        if (forbidden.test(spec) || (target && isDb(target))) offenders.push(`${file} imports ${spec}`);
      }
    }
    expect(offenders).toEqual([]);
  });
});
