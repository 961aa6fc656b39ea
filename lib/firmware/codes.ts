import { dutyCode, hysteresisCode, rampDownCode, rampUpCode, tempCode } from "../bank/quantise";
import type { CurveSettings, ProfileSettings } from "../profile/types";

/** One stored curve point: temperature code (× 0.5 °C) and duty code (× 0.5 %). */
export interface PointCodes {
  tempCode: number;
  dutyCode: number;
}

/** One stored curve block, as the integers the board holds (docs/bank-format.md, "Curve block"). */
export interface CurveCodes {
  /** × 0.1 °C. */
  hysteresisCode: number;
  /** × 0.5 %/s, i.e. duty codes per second. */
  rampUpCode: number;
  rampDownCode: number;
  points: PointCodes[];
}

/** The settings of one slot as stored integers; what firmware reads and what the vectors give. */
export interface SlotCodes {
  /** × 0.5 °C. */
  criticalTempCode: number;
  /** × 0.5 %. */
  sensorLossDutyCode: number;
  /** × 0.5 °C; null when the fans never stop (stored as 0xFF). */
  fanStopTempCode: number | null;
  pump: CurveCodes;
  fans: CurveCodes;
}

function curveCodes(curve: CurveSettings): CurveCodes {
  return {
    hysteresisCode: hysteresisCode(curve.hysteresisC),
    rampUpCode: rampUpCode(curve.rampUpPctPerSec),
    rampDownCode: rampDownCode(curve.rampDownPctPerSec),
    points: curve.points.map((p) => ({ tempCode: tempCode(p.tempC), dutyCode: dutyCode(p.dutyPct) })),
  };
}

/**
 * The integer codes a profile is stored as, with the bank encoder's rounding
 * (`tempCode`, `dutyCode`, … in lib/bank/quantise.ts). The encoder writes exactly
 * these bytes, and the editor's as-flashed curve and the firmware vectors are
 * computed from them, so preview and board cannot drift apart.
 */
export function slotCodes(profile: ProfileSettings): SlotCodes {
  const stop = profile.fans.stopBelowTempC;
  return {
    criticalTempCode: tempCode(profile.criticalTempC),
    sensorLossDutyCode: dutyCode(profile.sensorLossDutyPct),
    fanStopTempCode: stop === undefined ? null : tempCode(stop),
    pump: curveCodes(profile.pump),
    fans: curveCodes(profile.fans),
  };
}
