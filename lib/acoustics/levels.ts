/**
 * Sound level arithmetic. Levels are dB (A-weighted where the inputs are).
 * A silent source is -Infinity dB: it contributes nothing to a sum.
 */

/**
 * Level of a source at speed `rpm` from a reference level at `refRpm`:
 * L = Lref + k·log10(N/Nref), k = 50 by default. The fallback when a component has no
 * measured sound table. Basis, stated from memory and not checked against the text:
 * the fan law for sound power, Lw2 = Lw1 + 70·log10(D2/D1) + 50·log10(N2/N1)
 * (ASHRAE Handbook — HVAC Systems and Equipment, 2020 edition, ch. 21 "Fans",
 * fan-law table), which holds for one fan at geometrically similar operating points;
 * applied here to the sound pressure level at a fixed distance, which moves by the same
 * amount. Some small axial fans follow 55–60 (an observation, not a cited figure). For
 * pumps no comparable published law is used here: the pump takes the same exponent
 * only as an assumption of this tool, and it under-reads at low speed (the demo pumps
 * come out at 6–9 dB(A) at idle, below any room) — give a measured sound table.
 * A stopped source (rpm ≤ 0) gives -Infinity.
 */
export function levelAtSpeedDb(refDb: number, refRpm: number, rpm: number, exponent = 50): number {
  if (!(rpm > 0) || !(refRpm > 0)) return -Infinity;
  return refDb + exponent * Math.log10(rpm / refRpm);
}

/**
 * Incoherent (energy) sum of levels: L = 10·log10(Σ 10^(Li/10)) (common practice;
 * e.g. ASHRAE Handbook — Fundamentals, 2021 edition, ch. 8 "Sound and Vibration",
 * combining sound levels — chapter number from memory). Empty input or only silent
 * sources give -Infinity.
 */
export function addLevelsDb(levelsDb: readonly number[]): number {
  let sum = 0;
  for (const l of levelsDb) {
    if (l === -Infinity) continue;
    sum += 10 ** (l / 10);
  }
  return sum > 0 ? 10 * Math.log10(sum) : -Infinity;
}

/** Level of `count` identical incoherent sources: L + 10·log10(n) (the energy sum of n equal levels; two sources +3.01 dB). */
export function identicalSourcesDb(levelDb: number, count: number): number {
  if (!(count > 0) || levelDb === -Infinity) return -Infinity;
  return levelDb + 10 * Math.log10(count);
}

/**
 * Free-field level at `distanceM` from a level at 1 m: L − 20·log10(r / 1 m)
 * (inverse-square law for a point source, common practice; −6.02 dB per doubling of
 * distance). Valid only in the far field: callers refuse near-field distances
 * (near-field.ts).
 */
export function levelAtDistanceDb(levelAt1mDb: number, distanceM: number): number {
  if (!(distanceM > 0)) return Number.NaN;
  return levelAt1mDb - 20 * Math.log10(distanceM);
}
