/**
 * Reads a Chrome CPU profile (CDP `Profiler.stop`) of the production build back to the
 * sources: each sampled function's chunk position is looked up in the chunk's source map
 * (written when the build ran with LOOPKEEPER_BROWSER_SOURCEMAPS=1), so the breakdown names
 * our files and the packages' files instead of minified names. Without a map, the chunk file
 * and the minified name are shown.
 */
import { existsSync, readFileSync } from "node:fs";
import path from "node:path";
import { AnyMap, originalPositionFor, sourceContentFor, type TraceMap } from "@jridgewell/trace-mapping";

export interface CpuProfileNode {
  id: number;
  callFrame: { functionName: string; url: string; lineNumber: number; columnNumber: number };
  children?: number[];
}
export interface CpuProfile {
  nodes: CpuProfileNode[];
  startTime: number;
  endTime: number;
  samples?: number[];
  timeDeltas?: number[];
}

/** Where a sampled function comes from, as far as the maps tell. */
interface Origin {
  /** "react-dom", "monaco-editor", "components/profiles/editor", "(garbage collector)", … */
  area: string;
  /** Function name and original file:line (or the chunk and minified name without a map). */
  label: string;
}

export interface ProfileRow {
  what: string;
  ms: number;
  pct: number;
}

export interface ProfileSummary {
  /** Sampled wall time, ms, and the part not idle. */
  totalMs: number;
  busyMs: number;
  /** Self time by package or project folder. */
  areas: ProfileRow[];
  /** Self time by function. */
  selfTop: ProfileRow[];
  /** Total (self + callees) time of our own functions: components and engine calls. */
  ownTotalTop: ProfileRow[];
  mapped: boolean;
}

const VM_NAMES = new Set(["(idle)", "(program)", "(garbage collector)", "(root)"]);

/** The package (node_modules/<pkg> or @scope/pkg) or our folder of a source path from a map. */
function areaOf(source: string): string {
  const clean = source.replace(/^.*\[project\]\//, "").replace(/^(webpack|turbopack):\/+/, "").replace(/^(\.\.\/)+/, "");
  const nm = clean.lastIndexOf("node_modules/");
  if (nm >= 0) {
    const parts = clean.slice(nm + "node_modules/".length).split("/");
    return parts[0]?.startsWith("@") ? `${parts[0]}/${parts[1]}` : (parts[0] ?? clean);
  }
  const dir = path.posix.dirname(clean);
  return dir === "." ? clean : dir;
}

function cleanSource(source: string): string {
  const clean = source.replace(/^.*\[project\]\//, "").replace(/^(webpack|turbopack):\/+/, "").replace(/^(\.\.\/)+/, "");
  const nm = clean.lastIndexOf("node_modules/");
  return nm >= 0 ? clean.slice(nm + "node_modules/".length) : clean;
}

/** A readable function name from the original line: `function foo(`, `foo(…) {`, `const foo =`, `foo:`. */
function nameFromLine(line: string | undefined, column: number): string | null {
  if (!line) return null;
  const from = line.slice(Math.max(0, column - 80), column + 80);
  const patterns = [/function\s*\*?\s*([A-Za-z_$][\w$]*)/, /(?:const|let|var)\s+([A-Za-z_$][\w$]*)\s*=/, /([A-Za-z_$][\w$]*)\s*\([^)]*\)\s*\{/, /([A-Za-z_$][\w$]*)\s*:\s*(?:async\s*)?(?:function|\()/];
  for (const p of patterns) {
    const m = p.exec(from);
    if (m?.[1] && !["if", "for", "while", "switch", "catch", "return"].includes(m[1])) return m[1];
  }
  return null;
}

/** Resolves call frames of chunks served from `<distDir>/static/…` through their source maps. */
class Resolver {
  private maps = new Map<string, TraceMap | null>();
  private cache = new Map<string, Origin>();
  mapped = false;
  constructor(private readonly root: string, private readonly distDir: string) {}

  private mapFor(url: string): TraceMap | null {
    const at = url.indexOf("/_next/static/");
    if (at < 0) return null;
    const file = path.join(this.root, this.distDir, "static", decodeURIComponent(url.slice(at + "/_next/static/".length).split("?")[0]!));
    if (this.maps.has(file)) return this.maps.get(file)!;
    let map: TraceMap | null = null;
    // The chunk names its map on its last line (the map's file name need not be the chunk's).
    const named = existsSync(file) ? /\/\/# sourceMappingURL=(\S+)\s*$/.exec(readFileSync(file, "utf8"))?.[1] : undefined;
    const mapFile = named && !named.startsWith("data:") ? path.join(path.dirname(file), decodeURIComponent(named)) : `${file}.map`;
    if (existsSync(mapFile)) {
      map = new AnyMap(readFileSync(mapFile, "utf8"));
      this.mapped = true;
    }
    this.maps.set(file, map);
    return map;
  }

  origin(frame: CpuProfileNode["callFrame"]): Origin {
    const key = `${frame.url}:${frame.lineNumber}:${frame.columnNumber}:${frame.functionName}`;
    const hit = this.cache.get(key);
    if (hit) return hit;
    let origin: Origin;
    if (VM_NAMES.has(frame.functionName) && !frame.url) origin = { area: frame.functionName, label: frame.functionName };
    else if (!frame.url) origin = { area: "(V8 / browser built-ins, bench harness)", label: `${frame.functionName || "(anonymous)"} (no script)` };
    else if (!frame.url.includes("/_next/")) origin = { area: "(bench harness, page.evaluate)", label: `${frame.functionName || "(anonymous)"} — ${frame.url}` };
    else {
      const map = this.mapFor(frame.url);
      const chunk = frame.url.replace(/^.*\/_next\/static\//, "");
      const pos = map ? originalPositionFor(map, { line: frame.lineNumber + 1, column: frame.columnNumber }) : null;
      if (map && pos?.source) {
        const content = sourceContentFor(map, pos.source);
        const line = content?.split("\n")[pos.line - 1];
        const name = pos.name ?? nameFromLine(line, pos.column) ?? (frame.functionName || "(anonymous)");
        origin = { area: areaOf(pos.source), label: `${name} — ${cleanSource(pos.source)}:${pos.line}` };
      } else {
        origin = { area: `chunk ${chunk} (no source map)`, label: `${frame.functionName || "(anonymous)"} — ${chunk}:${frame.lineNumber + 1}:${frame.columnNumber + 1}` };
      }
    }
    this.cache.set(key, origin);
    return origin;
  }
}

const isOwn = (area: string) => /^(components|lib|app)(\/|$)/.test(area);

/** Self time by area and function, and total time of our own functions, over the whole profile. */
export function summariseProfile(profile: CpuProfile, opts: { root: string; distDir: string; top?: number }): ProfileSummary {
  const top = opts.top ?? 15;
  const resolver = new Resolver(opts.root, opts.distDir);
  const byId = new Map(profile.nodes.map((n) => [n.id, n]));
  const parent = new Map<number, number>();
  for (const n of profile.nodes) for (const c of n.children ?? []) parent.set(c, n.id);
  const selfMs = new Map<number, number>();
  const samples = profile.samples ?? [];
  const deltas = profile.timeDeltas ?? [];
  // A sample stands for the time until the next one (the last one for the time until the end).
  let at = profile.startTime;
  const times = deltas.map((d) => (at += d));
  for (let i = 0; i < samples.length; i++) {
    const next = i + 1 < times.length ? times[i + 1]! : profile.endTime;
    const ms = Math.max(0, next - times[i]!) / 1000;
    selfMs.set(samples[i]!, (selfMs.get(samples[i]!) ?? 0) + ms);
  }
  const totalMs = [...selfMs.values()].reduce((a, b) => a + b, 0);
  const area = new Map<string, number>();
  const self = new Map<string, number>();
  const ownTotal = new Map<string, number>();
  let idle = 0;
  for (const [id, ms] of selfMs) {
    const node = byId.get(id);
    if (!node) continue;
    const o = resolver.origin(node.callFrame);
    if (o.area === "(idle)") {
      idle += ms;
      continue;
    }
    area.set(o.area, (area.get(o.area) ?? 0) + ms);
    self.set(o.label, (self.get(o.label) ?? 0) + ms);
    // Our functions on this stack (each counted once, however deep the recursion).
    const seen = new Set<string>();
    for (let n: CpuProfileNode | undefined = node; n; n = parent.has(n.id) ? byId.get(parent.get(n.id)!) : undefined) {
      const on = resolver.origin(n.callFrame);
      if (!isOwn(on.area) || seen.has(on.label)) continue;
      seen.add(on.label);
      ownTotal.set(on.label, (ownTotal.get(on.label) ?? 0) + ms);
    }
  }
  const busyMs = totalMs - idle;
  const rows = (m: Map<string, number>, n: number) =>
    [...m.entries()]
      .sort((a, b) => b[1] - a[1])
      .slice(0, n)
      .map(([what, ms]) => ({ what, ms, pct: busyMs > 0 ? (100 * ms) / busyMs : 0 }));
  return { totalMs, busyMs, areas: rows(area, top), selfTop: rows(self, top), ownTotalTop: rows(ownTotal, top), mapped: resolver.mapped };
}
