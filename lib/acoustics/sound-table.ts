import type { SoundTable, SoundTablePoint } from "../hardware/types";

/**
 * The table's points of a turning motor (RPM above 0) by rising RPM. A valid table is
 * already so and is used as it is (it is only read); any other is copied, filtered and
 * sorted (a stable sort, so points at the same RPM keep their order either way).
 */
function runningPoints(table: SoundTable): readonly SoundTablePoint[] {
  const points = table.points;
  let usable = true;
  for (let i = 0; i < points.length && usable; i++) {
    if (!(points[i]!.rpm > 0) || (i > 0 && points[i]!.rpm < points[i - 1]!.rpm)) usable = false;
  }
  return usable ? points : points.filter((p) => p.rpm > 0).sort((a, b) => a.rpm - b.rpm);
}

/**
 * A measured sound table, prepared once: RPM → A-weighted level of one unit at the
 * table's own distance.
 *
 * Interpolation: linear in dB over log10(RPM) between neighbouring points. Between
 * two measured speeds this is a power law L = L1 + k12·log10(N/N1) with the slope k12
 * the two measurements give, the same shape as the fan-law fallback
 * (levels.ts, `levelAtSpeedDb`), so a table with two points reproduces a power law
 * exactly. Outside the measured range the level is **clamped** to the nearest end
 * point (not extrapolated): below the lowest measured speed that overstates the level
 * (the safe side for a noise estimate), above the highest it would understate it, so
 * validation warns when a table does not cover the motor's speed range
 * (`component.sound_table_range`). A stopped motor (RPM ≤ 0) is silent (-Infinity).
 *
 * Expects at least one point and strictly increasing RPM (what validation enforces);
 * points out of order are sorted here so that the result is still defined.
 */
export function prepareSoundTable(table: SoundTable): (rpm: number) => number {
  const points = [...runningPoints(table)]; // kept by the returned function, so its own copy
  const logs = points.map((p) => Math.log10(p.rpm));
  const levels = points.map((p) => p.soundDbA);
  const n = points.length;
  return (rpm) => {
    if (!(rpm > 0) || n === 0) return -Infinity;
    if (rpm <= points[0]!.rpm) return levels[0]!;
    if (rpm >= points[n - 1]!.rpm) return levels[n - 1]!;
    const x = Math.log10(rpm);
    let i = 1;
    while (i < n - 1 && logs[i]! < x) i++;
    const x0 = logs[i - 1]!;
    const x1 = logs[i]!;
    const l0 = levels[i - 1]!;
    const l1 = levels[i]!;
    return x1 > x0 ? l0 + ((l1 - l0) * (x - x0)) / (x1 - x0) : l1;
  };
}

/** Level of one unit at `rpm` at the table's distance, dB(A) (see prepareSoundTable). */
export function soundTableDbA(table: SoundTable, rpm: number): number {
  return prepareSoundTable(table)(rpm);
}

/**
 * The same table as relative sound power, 10^(L/10), at the table's distance, for power
 * sums: on each segment L = L0 + s·log10(N/N0), so 10^(L/10) = 10^(L0/10)·(N/N0)^(s/10) —
 * one power per call, like the fallback law (prepareCoolerTotal's hot loop). Clamped at
 * the ends and 0 when stopped, exactly as prepareSoundTable.
 */
export function prepareSoundTablePower(table: SoundTable): (rpm: number) => number {
  const points = runningPoints(table);
  const n = points.length;
  if (n === 0) return () => 0;
  const segments = points.slice(1).map((hi, i) => {
    const lo = points[i]!;
    const exponent = hi.rpm > lo.rpm ? (hi.soundDbA - lo.soundDbA) / 10 / Math.log10(hi.rpm / lo.rpm) : 0;
    // Relative to the segment's lower point, so (N/N0)^e stays between 1 and the segment's own ratio (no overflow on steep segments).
    return { fromRpm: lo.rpm, upToRpm: hi.rpm, exponent, power: 10 ** (lo.soundDbA / 10) };
  });
  const firstRpm = points[0]!.rpm;
  const lastRpm = points[n - 1]!.rpm;
  const firstPower = 10 ** (points[0]!.soundDbA / 10);
  const lastPower = 10 ** (points[n - 1]!.soundDbA / 10);
  return (rpm) => {
    if (!(rpm > 0)) return 0;
    if (rpm <= firstRpm) return firstPower;
    if (rpm >= lastRpm) return lastPower;
    let i = 0;
    while (i < segments.length - 1 && segments[i]!.upToRpm < rpm) i++;
    const seg = segments[i]!;
    return seg.power * (rpm / seg.fromRpm) ** seg.exponent;
  };
}
