// Each bench owns one marked section of docs/benchmarks.md and rewrites only that.
import { existsSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";

const DOC = path.resolve(__dirname, "..", "docs", "benchmarks.md");

/** Replaces the `<!-- bench:NAME:start -->…<!-- bench:NAME:end -->` section (which `section` must carry), or appends it. */
export function writeBenchSection(name: string, section: string): void {
  const existing = existsSync(DOC) ? readFileSync(DOC, "utf8") : "# Benchmarks\n";
  const re = new RegExp(`<!-- bench:${name}:start -->[\\s\\S]*?<!-- bench:${name}:end -->`);
  writeFileSync(DOC, re.test(existing) ? existing.replace(re, () => section) : `${existing.trimEnd()}\n\n${section}\n`);
}
