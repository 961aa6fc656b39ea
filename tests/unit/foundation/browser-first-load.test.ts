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
  { what: "semver (range matching loads when a range is checked, the version suggestion with the publish form)", matches: (s) => s === "semver" || s.startsWith("semver/") },
];

/**
 * The engine's public API (lib/engine/index.ts) re-exports every engine module; the bundler keeps
 * only the modules whose exports a screen imports from it (`npm run bench:bundle` measures what it
 * keeps), so an import of it is followed to those modules alone.
 */
const ENGINE_API = path.join("lib", "engine", "index.ts");



/** True when an import or export clause names types only (`type X`, `{ type A, type B }`): the compiler drops it. */
function typeOnly(clause: string): boolean {
  const c = clause.trim();
  if (c.startsWith("type ")) return true;
  const braces = /^\{([^}]*)\}$/.exec(c);
  if (!braces) return false;
  const names = braces[1]!.split(",").map((n) => n.trim()).filter(Boolean);
  return names.length > 0 && names.every((n) => n.startsWith("type "));
}

/** The value names a `{ a, b as c, type D }` clause imports or re-exports (`side` "imported": a, b; "exported": a, c); null for any other clause. */
function clauseNames(clause: string, side: "imported" | "exported"): string[] | null {
  const braces = /^\{([^}]*)\}$/.exec(clause.trim());
  if (!braces) return null;
  return braces[1]!
    .split(",")
    .map((n) => n.trim())
    .filter((n) => n !== "" && !n.startsWith("type "))
    .map((n) => {
      const [name, alias] = n.split(/\s+as\s+/);
      return side === "exported" ? (alias ?? name!) : name!;
    });
}

/** The specifiers a file imports for their value, loaded with it (not type-only, not `import()`), with the names it takes (null: all). */
function valueImportsNamed(file: string): { spec: string; names: string[] | null }[] {
  const text = fs.readFileSync(path.join(ROOT, file), "utf8");
  const out: { spec: string; names: string[] | null }[] = [];
  for (const m of text.matchAll(/(?:^|\n)\s*(?:import|export)\s+([^;'"]*?)\s+from\s+["']([^"']+)["']/g)) if (!typeOnly(m[1]!)) out.push({ spec: m[2]!, names: clauseNames(m[1]!, "imported") });
  for (const m of text.matchAll(/(?:^|\n)\s*import\s+["']([^"']+)["']/g)) out.push({ spec: m[1]!, names: null });
  return out;
}

/** The specifiers a file imports for their value, loaded with it (not type-only, not `import()`). */
function valueImports(file: string): string[] {
  return valueImportsNamed(file).map((i) => i.spec);
}

/** The modules of the engine's API that provide `names` (specifiers relative to it). */
function engineModulesFor(names: readonly string[]): string[] {
  const text = fs.readFileSync(path.join(ROOT, ENGINE_API), "utf8");
  const out: string[] = [];
  for (const m of text.matchAll(/(?:^|\n)\s*export\s+(\{[^}]*\})\s+from\s+["']([^"']+)["']/g)) {
    if ((clauseNames(m[1]!, "exported") ?? []).some((n) => names.includes(n))) out.push(m[2]!);
  }
  return out;
}

/** What loading `file` loads: its value imports, an import of the engine's API standing for the engine modules it names. */
function loadedWith(file: string): { from: string; spec: string }[] {
  return valueImportsNamed(file).flatMap(({ spec, names }) =>
    names && resolveLocal(file, spec) === ENGINE_API ? engineModulesFor(names).map((s) => ({ from: ENGINE_API, spec: s })) : [{ from: file, spec }],
  );
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
    for (const { from, spec } of loadedWith(cur.file)) {
      const file = resolveLocal(from, spec);
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
    // An import of the engine's API is followed to the modules that provide the names imported.
    expect(engineModulesFor(["suggestNextVersion", "operatingPoint"])).toEqual(["../thermal/operating-point", "../versioning/suggest"]);
    expect(reached.has(path.join("lib", "thermal", "operating-point.ts"))).toBe(true);
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
