/**
 * First-load JS per page route: `npm run bench:bundle`. Builds the app with `next build --analyze`
 * into .next-bundle (or reuses the build there; BENCH_REBUILD=1 builds again, NEXT_DIST_DIR=.next-test
 * reads another build), reads the build's diagnostics/route-bundle-stats.json (the chunks every
 * page route loads before anything on demand), gzips each chunk at level 9 and sums them per route,
 * and judges each route against its budget. For routes over budget it lists what their first load
 * is made of, from the analyzer's per-source sizes (`next analyze export`). Writes its section of
 * docs/benchmarks.md.
 */
import { spawnSync } from "node:child_process";
import { existsSync, readFileSync } from "node:fs";
import path from "node:path";
import { gzipSync } from "node:zlib";
import { writeBenchSection } from "./doc-section";

const root = path.resolve(__dirname, "..");
const distDir = process.env.NEXT_DIST_DIR ?? ".next-bundle";
const KiB = 1024;

/** Pages without the editor or plots. */
const PLAIN_BUDGET_KIB = 180;
/** Pages with plots or the editor, before the heavy parts load on demand. */
const HEAVY_BUDGET_KIB = 200;
/** Routes that show plots or the editor, and what those are. */
const HEAVY_ROUTES: Record<string, string> = {
  "/profiles/[id]": "curve editor (Monaco), live plot, sweep plot",
  "/profiles/[id]/compare": "compare plot",
  "/builds/[id]": "measured-against-estimated sound plot",
  "/lookup": "slot curve plots of a looked-up board",
};
/** How many sources to list per over-budget route. */
const TOP_SOURCES = 8;

interface RouteStats {
  route: string;
  firstLoadUncompressedJsBytes: number;
  firstLoadChunkPaths: string[];
}

interface Row {
  route: string;
  rawKiB: number;
  gzipKiB: number;
  budgetKiB: number;
  heavy: string | undefined;
  chunks: string[];
}

async function build() {
  const prep = (await import(path.join(root, "scripts/prepare.mjs"))) as { appEnv: (o: { database: string; port: number }) => Promise<NodeJS.ProcessEnv> };
  const env = await prep.appEnv({ database: "loopkeeper", port: 3000 });
  console.log(`Building into ${distDir} with the analyzer…`);
  const r = spawnSync("npx", ["next", "build", "--analyze"], { cwd: root, stdio: "inherit", env: { ...env, NEXT_DIST_DIR: distDir, NODE_ENV: "production", LOOPKEEPER_LOG: "silent" } });
  if (r.status !== 0) throw new Error(`next build failed (exit ${r.status ?? r.signal})`);
}

const gzipCache = new Map<string, number>();
function gzipBytes(file: string): number {
  let n = gzipCache.get(file);
  if (n === undefined) {
    n = gzipSync(readFileSync(path.join(root, file)), { level: 9 }).length;
    gzipCache.set(file, n);
  }
  return n;
}

function routeRows(): Row[] {
  const file = path.join(root, distDir, "diagnostics", "route-bundle-stats.json");
  const stats = JSON.parse(readFileSync(file, "utf8")) as RouteStats[];
  return stats
    .filter((s) => !s.route.startsWith("/api") && !s.route.startsWith("/_"))
    .map((s) => {
      const chunks = s.firstLoadChunkPaths.filter((p) => p.endsWith(".js"));
      const heavy = HEAVY_ROUTES[s.route];
      return {
        route: s.route,
        rawKiB: s.firstLoadUncompressedJsBytes / KiB,
        gzipKiB: chunks.reduce((sum, p) => sum + gzipBytes(p), 0) / KiB,
        budgetKiB: heavy ? HEAVY_BUDGET_KIB : PLAIN_BUDGET_KIB,
        heavy,
        chunks,
      };
    })
    .sort((a, b) => a.route.localeCompare(b.route));
}

interface Part {
  type: "part";
  filename: string;
  source_path: string;
  size: number;
  compressed_size: number;
}

interface Group {
  type: "group";
  kind: string;
  trigger_module_ident: string | null;
  outputs: string[];
}

/** Chunk groups the browser loads with the page (the framework's bootstrap and what rendering the route needs); "async" groups load on demand. */
const FIRST_LOAD_GROUPS = new Set(["bootstrap", "render_dependent"]);

/** Where a source comes from: its npm package, or the project folder (components/registry, lib/api/operations…). */
function origin(sourcePath: string): string {
  const p = sourcePath.replace(/^\[project\]\//, "").replace(/\\/g, "/");
  const nm = p.lastIndexOf("node_modules/");
  if (nm >= 0) {
    const rest = p.slice(nm + "node_modules/".length).split("/");
    return rest[0]!.startsWith("@") ? `${rest[0]}/${rest[1]}` : rest[0]!;
  }
  const dirs = p.split("/").slice(0, -1);
  return dirs.length ? `${dirs.join("/")}/` : p;
}

interface Analysis {
  /** The sources of the route's first load, summed by origin, largest first. */
  origins: { origin: string; rawKiB: number; compressedKiB: number }[];
  /** What the route can load later (next/dynamic, import()), by the module that asks for it, with what it adds. */
  onDemand: { trigger: string; rawKiB: number; compressedKiB: number }[];
}

const byCompressed = <T extends { compressedKiB: number }>(a: T, b: T) => b.compressedKiB - a.compressedKiB;

/** The module a chunk group is loaded for, as a project path or package name. */
function triggerName(ident: string): string {
  const p = ident.replace(/ \[.*$/, "").replace(/^\[project\]\//, "");
  const nm = p.lastIndexOf("node_modules/");
  return nm >= 0 ? origin(p) : p;
}

/**
 * A route's first load and its on-demand parts from the analyzer's own graph of the build (its
 * chunk names differ from the emitted ones, so its chunk groups say what loads first: the
 * framework's bootstrap and what rendering the route needs; "async" groups load on demand).
 * null when the build has no analyzer data.
 */
function analyse(route: string): Analysis | null {
  if (!existsSync(path.join(root, distDir, "diagnostics", "analyze", "history", "history.json"))) return null;
  const r = spawnSync("npx", ["next", "analyze", "export", "--dist-dir", distDir, "--route", route], { cwd: root, encoding: "utf8", maxBuffer: 512 * 1024 * 1024 });
  if (r.status !== 0) {
    console.warn(`analyzer export for ${route} failed: ${r.stderr.slice(0, 500)}`);
    return null;
  }
  const records = r.stdout
    .split("\n")
    .filter((line) => line.startsWith('{"type":"part"') || line.startsWith('{"type":"group"'))
    .map((line) => JSON.parse(line) as Part | Group);
  const clientJs = (g: Group) => g.outputs.filter((o) => o.startsWith("[client-fs]") && o.endsWith(".js"));
  const groups = records.filter((g): g is Group => g.type === "group");
  const parts = records.filter((p): p is Part => p.type === "part");
  const firstLoad = new Set(groups.filter((g) => FIRST_LOAD_GROUPS.has(g.kind)).flatMap(clientJs));
  const sums = new Map<string, { raw: number; compressed: number }>();
  for (const part of parts) {
    if (!firstLoad.has(part.filename)) continue;
    const key = origin(part.source_path);
    const s = sums.get(key) ?? { raw: 0, compressed: 0 };
    s.raw += part.size;
    s.compressed += part.compressed_size;
    sums.set(key, s);
  }
  const onDemand = groups
    .filter((g) => g.kind === "async" && g.trigger_module_ident?.includes("[app-client]"))
    .map((g) => {
      const outputs = new Set(clientJs(g).filter((o) => !firstLoad.has(o)));
      const mine = parts.filter((p) => outputs.has(p.filename));
      return { trigger: triggerName(g.trigger_module_ident ?? ""), rawKiB: mine.reduce((n, p) => n + p.size, 0) / KiB, compressedKiB: mine.reduce((n, p) => n + p.compressed_size, 0) / KiB };
    })
    .filter((g) => g.rawKiB > 0);
  // Monaco asks for its languages and workers one chunk each: one line per asking module.
  const merged = new Map<string, { trigger: string; rawKiB: number; compressedKiB: number }>();
  for (const g of onDemand) {
    const m = merged.get(g.trigger) ?? { trigger: g.trigger, rawKiB: 0, compressedKiB: 0 };
    m.rawKiB += g.rawKiB;
    m.compressedKiB += g.compressedKiB;
    merged.set(g.trigger, m);
  }
  return {
    origins: [...sums.entries()].map(([o, v]) => ({ origin: o, rawKiB: v.raw / KiB, compressedKiB: v.compressed / KiB })).sort(byCompressed),
    onDemand: [...merged.values()].sort(byCompressed),
  };
}

/** Per route, what loads later and for what (forms for people who may write, plots, the editor, zod on a form's first check). */
function onDemandSection(rows: Row[], analyses: Map<string, Analysis | null>): string[] {
  const lines = rows.flatMap((r) => {
    const a = analyses.get(r.route);
    if (!a || a.onDemand.length === 0) return [];
    const items = a.onDemand.map((g) => `${g.trigger} ${g.compressedKiB.toFixed(1)}`).join("; ");
    return [`| ${r.route} | ${items} |`];
  });
  if (lines.length === 0) return [];
  return [
    "",
    "### What loads later, on demand",
    "",
    "Chunks a route asks for after its first load (`next/dynamic`, `import()`), by the module that asks, with the analyzer's compressed estimate in KiB of what each adds. Plots, Monaco, the bank size check and the edit forms load when they are shown; the add forms are shown, and so loaded right after the page, only to people who may write; zod with the zod resolver loads on a form's first check (`@hookform/resolvers`) and with the schema module it imports; next-auth's client on sign-in and sign-out.",
    "",
    "| route | loaded on demand: trigger, compressed KiB (analyzer) |",
    "|---|---|",
    ...lines,
  ];
}

async function main() {
  if (!existsSync(path.join(root, distDir, "BUILD_ID")) || process.env.BENCH_REBUILD === "1") await build();
  const rows = routeRows();
  const over = rows.filter((r) => r.gzipKiB > r.budgetKiB);
  const analyses = new Map(rows.map((r) => [r.route, analyse(r.route)]));
  const commit = spawnSync("git", ["rev-parse", "--short", "HEAD"], { cwd: root, encoding: "utf8" }).stdout.trim();
  const buildId = readFileSync(path.join(root, distDir, "BUILD_ID"), "utf8").trim();

  const table = rows.map((r) => {
    const verdict = r.gzipKiB <= r.budgetKiB ? "met" : `over by ${(r.gzipKiB - r.budgetKiB).toFixed(1)}`;
    const kind = r.heavy ? `${r.budgetKiB} (${r.heavy} load on demand)` : `${r.budgetKiB}`;
    return `| ${r.route} | ${r.rawKiB.toFixed(0)} | ${r.gzipKiB.toFixed(1)} | ${kind} | ${verdict} |`;
  });
  const detail: string[] = [];
  for (const row of over) {
    const origins = analyses.get(row.route)?.origins;
    detail.push("", `#### ${row.route}: ${row.gzipKiB.toFixed(1)} KiB gzip, budget ${row.budgetKiB}`, "");
    if (!origins) {
      detail.push("No analyzer data in this build (build it with `BENCH_REBUILD=1 npm run bench:bundle`).");
      continue;
    }
    const total = origins.reduce((sum, o) => sum + o.rawKiB, 0);
    detail.push(`The analyzer counts ${total.toFixed(0)} KiB raw in this route's first load (the build's own list: ${row.rawKiB.toFixed(0)} KiB).`, "");
    detail.push("| from | raw KiB | compressed KiB (analyzer) |", "|---|---:|---:|");
    for (const o of origins.slice(0, TOP_SOURCES)) detail.push(`| ${o.origin} | ${o.rawKiB.toFixed(1)} | ${o.compressedKiB.toFixed(1)} |`);
  }
  const met = rows.length - over.length;
  const section = [
    "<!-- bench:bundle:start -->",
    "## First-load JS per page route",
    "",
    `Command: \`npm run bench:bundle\` (bench/bundle.ts). Production build \`${distDir}\` (build id ${buildId}, commit ${commit}), made by \`next build --analyze\` unless an existing build was reused. Run ${new Date().toISOString().slice(0, 16).replace("T", " ")} UTC.`,
    "",
    "First load is what a page route loads before anything on demand: the chunks the build lists for the route in `diagnostics/route-bundle-stats.json` (the route's page, layouts, loading and error screens, and the framework's shared chunks). raw is their bytes on disk; gzip is each chunk gzipped at level 9, summed. Code behind `next/dynamic` or `import()` (Monaco, recharts, the zxcvbn word lists, form schemas, next-auth's client) is not in it. Sizes do not depend on machine load.",
    "",
    `Budgets: ${PLAIN_BUDGET_KIB} KiB gzip for pages without the editor or plots; ${HEAVY_BUDGET_KIB} KiB for pages with plots or the editor, which load those parts on demand. ${met} of ${rows.length} routes met.`,
    "",
    "| route | raw KiB | gzip KiB | budget KiB gzip | result |",
    "|---|---:|---:|---|---|",
    ...table,
    ...(over.length
      ? ["", `### What the routes over budget load first`, "", "Sources in the route's first-load chunks, summed by npm package or project folder, largest first (the analyzer's sizes: raw is the source's share of the chunks, compressed the analyzer's own estimate per source, which runs higher than gzip of whole chunks; `next` includes the React DOM build it ships)."]
      : []),
    ...detail,
    ...onDemandSection(rows, analyses),
    "<!-- bench:bundle:end -->",
  ].join("\n");
  writeBenchSection("bundle", section);
  console.log(section);
}

main().catch((err: unknown) => {
  console.error(err);
  process.exit(1);
});
