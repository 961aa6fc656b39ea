/**
 * Direct editing of curves on the plot, kept in step with the JSON text: the
 * text edit that changes exactly one number (or inserts/removes one point), and
 * the limits a dragged handle stops at, with the reason shown beside it.
 */
export { applyTextEdit, changedSpan, formatNumber, insertPointEdit, numberSpan, removePointEdit, scanDocument, setNumberEdit, CurveEditError } from "./text-edit";
export type { TextEdit } from "./text-edit";
export {
  clampToBound,
  fanStopBound,
  hysteresisBound,
  newPointAt,
  pointDutyBound,
  pointTempBound,
  pointValueText,
  removalRefusal,
  snapToStep,
  HYSTERESIS_MAX_C,
  MAX_POINTS_PER_CURVE,
  MIN_POINTS_PER_CURVE,
} from "./constraints";
export type { Bound, Clamped, PointInsertion } from "./constraints";
