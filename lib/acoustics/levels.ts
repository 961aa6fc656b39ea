/**
 * Sound level arithmetic. Levels are dB (A-weighted where the inputs are).
 * A silent source is -Infinity dB: it contributes nothing to a sum.
 */

/**
 * Level of a source at speed `rpm` from a reference level at `refRpm`:
 * L = Lref + k·log10(N/Nref), k = 50 by default (fan-law sound scaling; ASHRAE
 * Handbook — HVAC Systems and Equipment, ch. "Fans", fan-law table; AMCA
 * Publication 301). A stopped source (rpm ≤ 0) gives -Infinity.
 */
export function levelAtSpeedDb(refDb: number, refRpm: number, rpm: number, exponent = 50): number {
  if (!(rpm > 0) || !(refRpm > 0)) return -Infinity;
  return refDb + exponent * Math.log10(rpm / refRpm);
}

/**
 * Incoherent sum of levels: L = 10·log10(Σ 10^(Li/10)) (ASHRAE Handbook —
 * Fundamentals, ch. "Sound and Vibration"). Empty input or only silent sources
 * give -Infinity.
 */
export function addLevelsDb(levelsDb: readonly number[]): number {
  let sum = 0;
  for (const l of levelsDb) {
    if (l === -Infinity) continue;
    sum += 10 ** (l / 10);
  }
  return sum > 0 ? 10 * Math.log10(sum) : -Infinity;
}

/** Level of `count` identical incoherent sources: L + 10·log10(n). */
export function identicalSourcesDb(levelDb: number, count: number): number {
  if (!(count > 0) || levelDb === -Infinity) return -Infinity;
  return levelDb + 10 * Math.log10(count);
}

/**
 * Free-field level at `distanceM` from a level at 1 m: L − 20·log10(r / 1 m)
 * (inverse-square law; −6.02 dB per doubling of distance).
 */
export function levelAtDistanceDb(levelAt1mDb: number, distanceM: number): number {
  if (!(distanceM > 0)) return Number.NaN;
  return levelAt1mDb - 20 * Math.log10(distanceM);
}
