import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { ROOT, resolveLocal as resolveIn, sourceFiles } from "./source-tree";

/**
 * What the screens' browser code loads with the page, read from the source: every module a
 * "use client" component (or instrumentation-client.ts) imports for its value, followed through
 * the project's files. Type-only imports and `import()`/`next/dynamic` (loaded on demand) are not
 * followed. The heavy or server-side parts below must only be reached on demand; `npm run
 * bench:bundle` measures the sizes, this keeps a static import from quietly bringing them back.
 */
const EXTENSIONS = ["", ".ts", ".tsx", "/index.ts", "/index.tsx"];
const resolveLocal = (from: string, spec: string) => resolveIn(from, spec, EXTENSIONS);

/** Packages and project modules a screen may load on demand but never with the page. */
const ON_DEMAND_ONLY: { what: string; matches: (spec: string, file: string | null) => boolean }[] = [
  { what: "zod (schemas are parsed on the server; forms load theirs when they first validate)", matches: (s) => s === "zod" || s.startsWith("zod/") },
  { what: "the zod resolver", matches: (s) => s.startsWith("@hookform/resolvers") },
  { what: "the operations with their schemas (screens call lib/api/endpoints)", matches: (_s, f) => f !== null && f.startsWith(path.join("lib", "api", "operations") + path.sep) },
  { what: "recharts", matches: (s) => s === "recharts" || s.startsWith("recharts/") },
  { what: "Monaco", matches: (s) => s === "monaco-editor" || s.startsWith("monaco-editor/") || s === "@monaco-editor/react" },
  { what: "zxcvbn", matches: (s) => s.startsWith("@zxcvbn-ts/") },
  { what: "next-auth's client", matches: (s) => s === "next-auth/react" },
  // The engine's API (lib/engine) re-exports semver's helpers: screens import engine modules directly.
  { what: "semver (range matching loads when a range is checked, the version suggestion with the publish form)", matches: (s) => s === "semver" || s.startsWith("semver/") },
];



/** True when an import or export clause names types only (`type X`, `{ type A, type B }`): the compiler drops it. */
function typeOnly(clause: string): boolean {
  const c = clause.trim();
  if (c.startsWith("type ")) return true;
  const braces = /^\{([^}]*)\}$/.exec(c);
  if (!braces) return false;
  const names = braces[1]!.split(",").map((n) => n.trim()).filter(Boolean);
  return names.length > 0 && names.every((n) => n.startsWith("type "));
}

/** The specifiers a file imports for their value, loaded with it (not type-only, not `import()`). */
function valueImports(file: string): string[] {
  const text = fs.readFileSync(path.join(ROOT, file), "utf8");
  const out: string[] = [];
  for (const m of text.matchAll(/(?:^|\n)\s*(?:import|export)\s+([^;'"]*?)\s+from\s+["']([^"']+)["']/g)) if (!typeOnly(m[1]!)) out.push(m[2]!);
  for (const m of text.matchAll(/(?:^|\n)\s*import\s+["']([^"']+)["']/g)) out.push(m[1]!);
  return out;
}

const isClient = (file: string) => /^\s*(?:\/\/[^\n]*\n\s*)*["']use client["']/.test(fs.readFileSync(path.join(ROOT, file), "utf8"));

/** The files the framework loads for screens: pages, layouts and their loading, error and not-found screens. */
const SCREEN_FILE = /^(page|layout|template|loading|error|global-error|not-found|forbidden|unauthorized)\.tsx$/;
const appEntries = sourceFiles("app").filter((f) => SCREEN_FILE.test(path.basename(f)));

/**
 * Every module the browser loads with a page, with one import chain that reaches it: from the
 * screens' files through their static imports, the browser's part starting at each "use client"
 * module (and instrumentation-client.ts, which runs before every screen).
 */
function firstLoad(): Map<string, { spec: string; file: string | null; via: string[] }> {
  const reached = new Map<string, { spec: string; file: string | null; via: string[] }>();
  const start = [...appEntries.map((f) => ({ file: f, client: isClient(f), via: [f] })), { file: "instrumentation-client.ts", client: true, via: ["instrumentation-client.ts"] }];
  const seen = new Set(start.map((s) => `${s.client}:${s.file}`));
  const queue = [...start];
  while (queue.length) {
    const cur = queue.shift()!;
    for (const spec of valueImports(cur.file)) {
      const file = resolveLocal(cur.file, spec);
      const client = cur.client || (file !== null && isClient(file));
      const key = file ?? spec;
      if (client && !reached.has(key)) reached.set(key, { spec, file, via: [...cur.via, key] });
      if (file && !seen.has(`${client}:${file}`)) {
        seen.add(`${client}:${file}`);
        queue.push({ file, client, via: [...cur.via, file] });
      }
    }
  }
  return reached;
}

describe("what screens load with the page", () => {
  const reached = firstLoad();

  it("reads a realistic graph (guards against a parser that finds nothing)", () => {
    expect(appEntries.length).toBeGreaterThan(40);
    expect(reached.size).toBeGreaterThan(100);
    expect(reached.has("@tanstack/react-query")).toBe(true);
    expect(reached.has(path.join("lib", "api", "endpoints.ts"))).toBe(true);
    // The charts exist and import recharts; they are only reached through next/dynamic.
    expect(valueImports(path.join("components", "builds", "sound-plot.tsx"))).toContain("recharts");
  });

  it("reaches zod, the schemas, recharts, Monaco, zxcvbn, next-auth's client and semver only on demand", () => {
    const found: string[] = [];
    for (const { spec, file, via } of reached.values()) {
      const rule = ON_DEMAND_ONLY.find((r) => r.matches(spec, file));
      if (rule) found.push(`${rule.what}: ${via.join(" → ")}`);
    }
    expect(found).toEqual([]);
  });
});
