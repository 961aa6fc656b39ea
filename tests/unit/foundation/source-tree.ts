// Reading the project's own source tree as text, for the tests that check its import graph.
import fs from "node:fs";
import path from "node:path";

export const ROOT = process.cwd();

/** TypeScript sources below `dir` (relative to the project root), declaration files left out. */
export function sourceFiles(dir: string): string[] {
  const abs = path.join(ROOT, dir);
  if (!fs.existsSync(abs)) return [];
  return fs.readdirSync(abs, { withFileTypes: true }).flatMap((e) => {
    const rel = path.join(dir, e.name);
    if (e.isDirectory()) return sourceFiles(rel);
    return /\.tsx?$/.test(e.name) && !e.name.endsWith(".d.ts") ? [rel] : [];
  });
}

/** The project file an `@/…` or relative specifier names, trying `endings` in order; null for packages. */
export function resolveLocal(from: string, spec: string, endings: readonly string[]): string | null {
  let base: string;
  if (spec.startsWith("@/")) base = spec.slice(2);
  else if (spec.startsWith(".")) base = path.join(path.dirname(from), spec);
  else return null;
  for (const ext of endings) {
    const candidate = path.normalize(base + ext);
    if (fs.existsSync(path.join(ROOT, candidate)) && fs.statSync(path.join(ROOT, candidate)).isFile()) return candidate;
  }
  return null;
}
