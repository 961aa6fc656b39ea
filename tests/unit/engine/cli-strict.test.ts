import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { writeIntelHex } from "@/lib/engine";
import { demoBankImages } from "./demo-images";

const root = path.resolve(__dirname, "../../..");

/** `npm run -s cli -- …`, as a firmware pipeline calls it. */
function npmCli(...args: string[]): { code: number | null; stdout: string; stderr: string } {
  const r = spawnSync("npm", ["run", "-s", "cli", "--", ...args], { cwd: root, encoding: "utf8", timeout: 60_000 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

describe("cli inspect is strict", { timeout: 90_000 }, () => {
  it("exits 1 on a HEX with two records for one address, naming both lines", () => {
    const dir = mkdtempSync(path.join(tmpdir(), "loopkeeper-strict-"));
    const lines = writeIntelHex(demoBankImages()[0]!.bytes, 0x0801f800).trim().split("\n");
    // Line 3 written again after line 5: the same 16 addresses twice.
    lines.splice(5, 0, lines[2]!);
    const file = path.join(dir, "twice.hex");
    writeFileSync(file, `${lines.join("\n")}\n`);
    const r = npmCli("inspect", file);
    expect(r.code).toBe(1);
    expect(r.stderr).toMatch(/twice\.hex:6: error hex\.overlap: Lines 3 and 6 both write address 0x0801F810–0x0801F81F/);
    const good = path.join(dir, "good.hex");
    lines.splice(5, 1);
    writeFileSync(good, `${lines.join("\n")}\n`);
    expect(npmCli("inspect", good).code).toBe(0);
  });
});
