/**
 * Background noise correction of a measured sound pressure level, as ISO 3744:2010
 * (engineering method, §8.2.3) and ISO 3745 (precision method) define it: the level
 * measured with the source running, L'p, includes the room's background Lp(B); with
 * ΔL = L'p − Lp(B) the source alone is L'p − K1, where
 *
 *   K1 = −10·log10(1 − 10^(−0.1·ΔL)) dB.
 *
 * Limits (ISO 3744:2010 §8.2.3, stated from memory, not checked against the text):
 * from ΔL = 15 dB up no correction is applied (K1 would be at most 0.14 dB); from 6 dB to
 * 15 dB K1 applies; below 6 dB the source cannot be told from the background (the
 * standard then only allows an upper bound), so the point is not comparable. ISO 3745's
 * precision grade asks for a larger difference (10 dB, also from memory); pass it as
 * `minDifferenceDb` where that grade is wanted.
 */

/** ΔL from which no correction is applied, dB. */
export const NO_CORRECTION_FROM_DB = 15;
/** Smallest ΔL at which a corrected level is still a measurement of the source, dB (ISO 3744:2010). */
export const ISO_3744_MIN_DIFFERENCE_DB = 6;

/** K1 for a difference ΔL (dB) between the level with the source running and the background alone. */
export function backgroundCorrectionK1(differenceDb: number): number {
  return -10 * Math.log10(1 - 10 ** (-0.1 * differenceDb));
}

export type BackgroundCorrection =
  | { state: "no_background"; correctedDbA: number; correctionDb: 0; differenceDb: null }
  | { state: "uncorrected"; correctedDbA: number; correctionDb: 0; differenceDb: number }
  | { state: "corrected"; correctedDbA: number; correctionDb: number; differenceDb: number }
  | { state: "too_close"; correctedDbA: null; correctionDb: null; differenceDb: number };

/**
 * The source's own level from a measured level and the room's background (null when the
 * lab gave none: the measured level is taken as it is).
 */
export function correctForBackground(measuredDbA: number, backgroundDbA: number | null, minDifferenceDb = ISO_3744_MIN_DIFFERENCE_DB): BackgroundCorrection {
  if (backgroundDbA === null) return { state: "no_background", correctedDbA: measuredDbA, correctionDb: 0, differenceDb: null };
  const differenceDb = measuredDbA - backgroundDbA;
  if (differenceDb >= NO_CORRECTION_FROM_DB) return { state: "uncorrected", correctedDbA: measuredDbA, correctionDb: 0, differenceDb };
  if (differenceDb < minDifferenceDb) return { state: "too_close", correctedDbA: null, correctionDb: null, differenceDb };
  const correctionDb = backgroundCorrectionK1(differenceDb);
  return { state: "corrected", correctedDbA: measuredDbA - correctionDb, correctionDb, differenceDb };
}
