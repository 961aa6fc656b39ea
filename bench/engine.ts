/**
 * Engine benchmark: `npm run bench:engine`. Times validate + evaluate, the
 * operating-point load sweep and bank encoding over generated profiles, then
 * writes its section of docs/benchmarks.md (between its own markers only).
 */
import { readFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { encodeBank, evaluateCurves, loadSweep, validateProfile, type CoolingProfile, type CurvePoint, type HardwareContext } from "../lib/engine";
import { writeBenchSection } from "./doc-section";

const PROFILES = 10_000;
const loadAtStart = os.loadavg()[0]!;
const root = path.resolve(__dirname, "..");
const hw = JSON.parse(readFileSync(path.join(root, "examples/cooler-360.hardware.json"), "utf8")) as HardwareContext;

/** Small deterministic PRNG (mulberry32) so runs compare. */
function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function curve(rand: () => number, n: number, minDuty: number, endC: number): CurvePoint[] {
  const points: CurvePoint[] = [];
  const startC = 20 + Math.floor(rand() * 20) / 2;
  const stepC = (endC - startC) / (n - 1);
  let duty = minDuty + Math.floor(rand() * 20) / 2;
  for (let i = 0; i < n; i++) {
    points.push({ tempC: Math.round((startC + stepC * i) * 2) / 2, dutyPct: i === n - 1 ? 100 : duty });
    duty = Math.min(100, duty + Math.floor(rand() * 30) / 2);
  }
  return points;
}

function generate(count: number): CoolingProfile[] {
  const rand = rng(20240601);
  return Array.from({ length: count }, (_, i) => {
    const criticalTempC = 55 + Math.floor(rand() * 10);
    const profile: CoolingProfile = {
      formatVersion: 1,
      name: `Generated ${i}`,
      criticalTempC,
      sensorLossDutyPct: 100,
      pump: { points: curve(rand, 3 + Math.floor(rand() * 6), 40, criticalTempC - 2), hysteresisC: 1, rampUpPctPerSec: 10, rampDownPctPerSec: 5 },
      fans: { points: curve(rand, 3 + Math.floor(rand() * 6), 20, criticalTempC - 1), hysteresisC: 1.5, rampUpPctPerSec: 10, rampDownPctPerSec: 5 },
    };
    if (rand() < 0.5) profile.fans.stopBelowTempC = 28;
    return profile;
  });
}

interface Timing {
  label: string;
  /** Process CPU time (user + system) per profile in the first pass, JIT compilation included. */
  firstCpuUsPerProfile: number;
  /** Process CPU time (user + system) per profile in the second pass: steady on a shared, busy machine. */
  cpuUsPerProfile: number;
  /** Wall-clock time per profile: what a user waits, inflated when other processes compete for the CPU. */
  wallUsPerProfile: number;
}

function pass(profiles: readonly CoolingProfile[], fn: (p: CoolingProfile) => void): { cpuUs: number; wallUs: number } {
  const cpu = process.cpuUsage();
  const started = process.hrtime.bigint();
  for (const p of profiles) fn(p);
  const ns = Number(process.hrtime.bigint() - started);
  const used = process.cpuUsage(cpu);
  return { cpuUs: (used.user + used.system) / profiles.length, wallUs: ns / 1000 / profiles.length };
}

/**
 * Two passes over the same profiles: the first while V8 still compiles and optimises the hot
 * functions (its compiler threads count in process CPU time), the second in the steady state a
 * running server is in. The target is judged on the second; the first is shown beside it.
 */
function time(label: string, profiles: readonly CoolingProfile[], fn: (p: CoolingProfile) => void): Timing {
  const first = pass(profiles, fn);
  const steady = pass(profiles, fn);
  return { label, firstCpuUsPerProfile: first.cpuUs, cpuUsPerProfile: steady.cpuUs, wallUsPerProfile: steady.wallUs };
}

const profiles = generate(PROFILES);
let invalid = 0;
const results = [
  time("validate + evaluate (20–70 °C, 1 °C steps)", profiles, (p) => {
    if (!validateProfile(p, hw).ok) invalid++; // counted in both passes; halved below
    evaluateCurves(p, hw, { fromC: 20, toC: 70, stepC: 1 });
  }),
  time("operating-point sweep (31 loads, 50–350 W)", profiles, (p) => void loadSweep(p, hw, { ambientC: 25 })),
  time("encode (1 slot, with content hash)", profiles, (p) => {
    if (!encodeBank([{ profile: p, version: "1.2.3" }]).ok) throw new Error("encode failed");
  }),
];
const maxRssMiB = process.resourceUsage().maxRSS / 1024;
const cores = os.cpus().length;
const loadAtEnd = os.loadavg()[0]!;
const heapMiB = process.memoryUsage().heapUsed / 1024 / 1024;

const targets: Record<string, number> = { [results[0]!.label]: 50, [results[1]!.label]: 500 };
const rows = results.map((r) => `| ${r.label} | ${r.cpuUsPerProfile.toFixed(1)} | ${r.wallUsPerProfile.toFixed(1)} | ${r.firstCpuUsPerProfile.toFixed(1)} | ${targets[r.label] !== undefined ? `< ${targets[r.label]}` : "—"} |`);
const section = [
  "<!-- bench:engine:start -->",
  "## Engine",
  "",
  "Command: `npm run bench:engine` (bench/engine.ts). " +
    `${PROFILES.toLocaleString("en")} generated profiles (3–8 points per curve, half with fan stop), example hardware context (fans that stop at 0 % duty with the fallback sound law, a pump with a measured sound table), each step run twice over the same profiles: the first pass while V8 compiles and optimises (its compiler threads count in process CPU time), the second in the steady state of a running server, which the targets are judged on.`,
  "",
  `Machine: Node ${process.version}, ${cores} × ${os.cpus()[0]?.model ?? "cpu"}, ${os.platform()}, load average ${loadAtStart.toFixed(1)} at the start and ${loadAtEnd.toFixed(1)} at the end of the run (the CPU column is the steadier one on a shared machine). Run ${new Date().toISOString().slice(0, 16).replace("T", " ")} UTC.` +
    (Math.max(loadAtStart, loadAtEnd) >= cores
      ? ` **Loaded machine**: the load average was at or above the ${cores} cores, so other work competed for the CPU; these figures are not valid against the targets — rerun on a quiet machine before judging them.`
      : ""),
  "",
  "| step | CPU µs per profile (second pass) | wall µs per profile (second pass) | first pass CPU µs, compiling | target µs (second pass CPU) |",
  "|---|---:|---:|---:|---:|",
  ...rows,
  "",
  `Peak memory: max RSS ${maxRssMiB.toFixed(0)} MiB; heap in use at the end ${heapMiB.toFixed(0)} MiB. Profiles failing validation: ${invalid / 2} (expected 0).`,
  "<!-- bench:engine:end -->",
].join("\n");

writeBenchSection("engine", section);
console.log(section);
