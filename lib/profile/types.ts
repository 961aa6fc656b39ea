/**
 * TypeScript shape of `schemas/cooling-profile.schema.json`. Keep the two in
 * step: the schema test checks that every property named here is in the schema.
 */

/** One curve point: at `tempC` liquid temperature the curve asks for `dutyPct`. */
export interface CurvePoint {
  tempC: number;
  dutyPct: number;
}

/** Points, hysteresis and ramp limits common to the pump and the fan curve. */
export interface CurveSettings {
  points: CurvePoint[];
  hysteresisC: number;
  rampUpPctPerSec: number;
  rampDownPctPerSec: number;
}

/** The pump curve; a pump never stops, so it has no stop temperature. */
export type PumpCurve = CurveSettings;

/** The fan curve; the fans may stop below `stopBelowTempC` when it is set. */
export interface FanCurve extends CurveSettings {
  stopBelowTempC?: number;
}

/** What the board stores of a profile: everything except names and text. */
export interface ProfileSettings {
  criticalTempC: number;
  sensorLossDutyPct: number;
  pump: PumpCurve;
  fans: FanCurve;
}

/** A whole cooling profile document. */
export interface CoolingProfile extends ProfileSettings {
  $schema?: string;
  formatVersion: 1;
  name: string;
  description?: string;
}

/** Which of the two curves of a profile. */
export type CurveKind = "pump" | "fans";
