/**
 * What the board's firmware does with a bank, in integers: the stored codes, the
 * control law (interpolation, hysteresis, ramp limits, fan stop, critical override,
 * sensor dropouts), test vectors from a bank image, and the C99 reference.
 * docs/firmware-vectors.md spells the arithmetic out.
 */
export { slotCodes } from "./codes";
export type { SlotCodes, CurveCodes, PointCodes } from "./codes";
export { curveDutyCode, steadyDutyCodes, controlTick, runTrace, initialControlState, holdDeciC, rampDutyCode, DECI_C_PER_TEMP_CODE, TICK_MS, SENSOR_GLITCH_TICKS } from "./control";
export type { SteadyDuty, TickOutput, ControlState, CurveControlState } from "./control";
export { flashedStateAt } from "./as-flashed";
export type { FlashedState } from "./as-flashed";
export { slotTraces } from "./traces";
export type { TraceInput } from "./traces";
export { bankVectors, vectorsJson, VECTORS_FORMAT, VECTORS_FORMAT_VERSION } from "./vectors";
export type { FirmwareVectors, SlotVectors, TraceVector, VectorsResult } from "./vectors";
export { cReferenceFiles, C_HEADER_FILE, C_SOURCE_FILE } from "./c-reference";
