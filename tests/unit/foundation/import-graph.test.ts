import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";

/**
 * The layering read from the source itself: db/ is storage that nothing it imports may reach
 * back into, and lib/<domain> stays pure (no React, Next or database) so it runs anywhere.
 */
const ROOT = process.cwd();
const SOURCE_DIRS = ["app", "components", "db", "lib", "cli"];
const EXTENSIONS = [".ts", ".tsx", "/index.ts", "/index.tsx"];

function sourceFiles(dir: string): string[] {
  const abs = path.join(ROOT, dir);
  if (!fs.existsSync(abs)) return [];
  return fs.readdirSync(abs, { withFileTypes: true }).flatMap((e) => {
    const rel = path.join(dir, e.name);
    if (e.isDirectory()) return sourceFiles(rel);
    return /\.tsx?$/.test(e.name) && !e.name.endsWith(".d.ts") ? [rel] : [];
  });
}

function specifiers(file: string): string[] {
  const text = fs.readFileSync(path.join(ROOT, file), "utf8");
  const out: string[] = [];
  for (const m of text.matchAll(/(?:^|\n)\s*(?:import|export)\s[^;]*?from\s+["']([^"']+)["']/g)) out.push(m[1]!);
  for (const m of text.matchAll(/\bimport\(\s*["']([^"']+)["']\s*\)/g)) out.push(m[1]!);
  for (const m of text.matchAll(/(?:^|\n)\s*import\s+["']([^"']+)["']/g)) out.push(m[1]!);
  return out;
}

function resolveLocal(from: string, spec: string): string | null {
  let base: string;
  if (spec.startsWith("@/")) base = spec.slice(2);
  else if (spec.startsWith(".")) base = path.join(path.dirname(from), spec);
  else return null;
  for (const ext of ["", ...EXTENSIONS]) {
    const candidate = path.normalize(base + ext);
    if (fs.existsSync(path.join(ROOT, candidate)) && fs.statSync(path.join(ROOT, candidate)).isFile()) return candidate;
  }
  return null;
}

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
