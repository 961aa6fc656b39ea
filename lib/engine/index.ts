/**
 * Public API of the Loopkeeper curve engine: pure TypeScript, no framework or
 * database imports, runs in the browser and in Node. Estimates only — a
 * release still needs lab measurement on real hardware.
 */

// ── Documents ────────────────────────────────────────────────────────────────
/** Profile document types (schemas/cooling-profile.schema.json). */
export type { CoolingProfile, ProfileSettings, PumpCurve, FanCurve, CurveSettings, CurvePoint, CurveKind } from "../profile/types";
/** Hardware context types (schemas/hardware-context.schema.json). */
export type { HardwareContext, MotorComponent, PumpComponent, RadiatorThermal, BoardRevision, SoundTable, SoundTablePoint } from "../hardware/types";
/** Sound exponent when a component gives none (50, fan-law sound scaling); stopped-radiator factor (3×, assumption); radiator size assumed for the near-field check (480 mm, assumption). */
export { DEFAULT_SOUND_EXPONENT, DEFAULT_STOPPED_RESISTANCE_FACTOR, DEFAULT_LARGEST_DIMENSION_MM } from "../hardware/types";
/** Canonical JSON (sorted keys, no whitespace) and its SHA-256 hex: the content identity of a document. */
export { canonicalJson, contentHashHex } from "../profile/canonical";
/** Thrown by computations on out-of-range numbers; names the parameter. */
export { EngineInputError } from "../guards/input-error";

// ── Validation ───────────────────────────────────────────────────────────────
/** Schema + semantic validation of a parsed profile; never throws. */
export { validateProfile, validateHardware, validateProfileText, validateHardwareText, MAX_TEXT_LENGTH } from "../validation/validate";
/** Issue and result types of validation. */
export type { ValidationIssue, ValidationResult, IssueSeverity } from "../validation/types";
/** JSON pointer → 1-based line/column range in the text, for editor markers. */
export { pointerToRange, PointerLocator, offsetToPosition, lineStarts } from "../validation/positions";
/** 1-based line/column and a start–end range in text. */
export type { TextPosition, TextRange } from "../validation/positions";

// ── Speeds ───────────────────────────────────────────────────────────────────
/** Curve duty at a temperature: linear between points, held outside them. */
export { dutyAtTemp, maxDutyPct } from "../speeds/curve";
/** Duty → RPM: linear from (min duty, RPM at min) to (100 %, max RPM); below, min RPM — or 0 RPM at 0 % for a fan that stops at 0 % duty. */
export { dutyToRpm, rpmAtZeroDuty } from "../speeds/rpm";
/** Steady-state pump/fan duty and RPM at a liquid temperature (fan stop, critical override). */
export { pumpStateAt, fanStateAt, fansStoppedAt } from "../speeds/at-temp";
/** Duty, RPM and stopped flag of a motor group. */
export type { MotorState } from "../speeds/at-temp";
/** Temperature → duty/RPM/noise table for plots (default 20–70 °C, 1 °C steps). */
export { evaluateCurves } from "../evaluation/curve-table";
/** One row of the curve table, and its range options. */
export type { CurveRow, CurveTableOptions } from "../evaluation/curve-table";

// ── Acoustics ────────────────────────────────────────────────────────────────
/** L = Lref + k·log10(N/Nref); incoherent sum; n sources +10·log10(n); −20·log10(r). */
export { levelAtSpeedDb, addLevelsDb, identicalSourcesDb, levelAtDistanceDb } from "../acoustics/levels";
/** Noise of a cooler (fans × n + pump) at 1 m and at a listener distance; one unit's level from its sound table or the fallback law. */
export { coolerNoise, coolerTotalDbA1m, prepareCoolerTotal, componentLevelDbA, prepareComponentLevel } from "../acoustics/cooler-noise";
/** Measured sound table: linear in dB over log RPM, clamped to its end points. */
export { prepareSoundTable, soundTableDbA } from "../acoustics/sound-table";
/** Listener distances inside the cooler's near field (below about the radiator's largest dimension) are refused. */
export { nearFieldLimitM, listenerDistanceProblem, requireListenerDistance } from "../acoustics/near-field";
/** Fans, pump and total levels at 1 m and at the listener distance. */
export type { NoiseEstimate } from "../acoustics/cooler-noise";

// ── Thermal ──────────────────────────────────────────────────────────────────
/** Radiator resistance R(N), linear in N^-0.8 between the min- and max-speed anchors. */
export { radiatorResistanceKPerW, prepareRadiator, AIR_SIDE_EXPONENT } from "../thermal/resistance";
/** Coolants (water 25 °C, PG 30 %), ΔT = Q/(ṁ·c_p), flow ∝ pump RPM. */
export { coolantRiseK, pumpFlowLpm, WATER_25C, PROPYLENE_GLYCOL_30, COOLANTS } from "../thermal/coolant";
/** Density (kg/m³) and specific heat (J/kg·K) of a coolant. */
export type { Coolant } from "../thermal/coolant";
/** Steady liquid temperature T = Tamb + P·R(N(T)) by bisection, and a load sweep. */
export { operatingPoint, loadSweep, heatBalanceResidualK, DEFAULT_TOLERANCE_K } from "../thermal/operating-point";
/** Steady state at one load (liquid °C, speeds, flow, ΔT, noise, critical flag) and its options. */
export type { OperatingPoint, OperatingPointOptions, LoadSweepOptions } from "../thermal/operating-point";

// ── Transient ────────────────────────────────────────────────────────────────
/** Hysteresis (play operator) and ramp limits over a temperature trace. */
export { simulateTransient, applyHysteresisC, applyRampPct, MAX_TRACE_SAMPLES } from "../transient/simulate";
/** Trace input ({ tSec, tempC | null }) and per-sample pump/fan output. */
export type { TraceSample, TransientSample, TransientMotor } from "../transient/simulate";

// ── Bank image ───────────────────────────────────────────────────────────────
/** The as-flashed profile (0.5 °C / 0.5 % steps, rounded toward more cooling). */
export { quantise } from "../bank/quantise";
/** Encode profile versions into a bank image with CRC-32 trailer (docs/bank-format.md). */
export { encodeBank, versionBytes } from "../bank/encode";
/** Decode a bank image or memory dump; never throws. */
export { decodeBank } from "../bank/decode";
/** Identify slots by content: exact only when the bytes equal the registry's encoding; differences in the trade's units; authoring rules on every slot. */
export { identifySlots, registrySlotBytes, slotDifferences, slotFindings, dumpKeys, imageSha256 } from "../bank/identify";
/** A registry version and build to match against, and the report of one slot (exact / altered / unknown / undecodable). */
export type { RegistryVersion, RegistryBuild, SlotReport, SlotMatch, SlotFinding, DumpKeys } from "../bank/identify";
/** The whole dump report the command line, the API and the support page show. */
export { reportDump, looksLikeIntelHex } from "../bank/dump-report";
export type { DumpReport, DumpInput } from "../bank/dump-report";
/** The dump's Ed25519 signature: valid / invalid / not checked / unsigned, from a .sig, the block after the CRC, or the matching build. */
export { judgeSignature } from "../bank/dump-signature";
export type { DumpSignature, SigningKeyRef, VerifySignature, SignatureSource } from "../bank/dump-signature";
/** Image size of a set of slots, and the format constants. */
export { bankBytes, slotBytes, BANK_MAGIC, BANK_FORMAT_VERSION, TEMP_STEP_C, DUTY_STEP_PCT } from "../bank/layout";
/** Encoder input and results, decoded slots, and issues with code, offset, expected/actual. */
export type { BankIssue, BankSlotInput, DecodedSlot, EncodeBankResult, DecodeBankResult, UndecodableSlot } from "../bank/types";

// ── Checksums and Intel HEX ──────────────────────────────────────────────────
/** CRC-32/ISO-HDLC (zlib): check "123456789" → 0xCBF43926. */
export { crc32 } from "../checksums/crc32";
/** SHA-256 (FIPS 180-4) in plain TypeScript, and hex formatting. */
export { sha256, toHex } from "../checksums/sha256";
/** Intel HEX writer: type-04 at the base address, 16-byte data records, EOF. */
export { writeIntelHex } from "../hex/write";
/** Intel HEX reader: checks every record checksum, 02/04 addresses; never throws. */
export { readIntelHex } from "../hex/read";
/** Reader result (start address, bytes) and issues with their line. */
export type { HexIssue, HexStartRecord, ReadHexResult } from "../hex/read";
/** Record checksum (two's complement of the byte sum) and the EOF record ":00000001FF". */
export { recordChecksum, EOF_RECORD } from "../hex/record";

// ── Versions ─────────────────────────────────────────────────────────────────
/** Suggested next semver from a document diff (rule in docs/versioning.md). */
export { suggestNextVersion } from "../versioning/suggest";
/** Suggested version, bump kind and the reasons found. */
export type { VersionSuggestion, VersionBump } from "../versioning/suggest";
/** Board revision compatible = version in range and image fits memory. */
export { isRevisionCompatible } from "../versioning/compatibility";
/** Input and { ok, reasons } of the compatibility check. */
export type { RevisionCompatibility, RevisionCompatibilityInput } from "../versioning/compatibility";
/** Semver precedence helpers (semver.org 2.0.0 §11) over the `semver` package. */
export { compareVersions, sortVersions, latestVersion, isValidVersion, isValidRange, satisfiesRange } from "../versioning/semver-helpers";

// ── Tach ─────────────────────────────────────────────────────────────────────
/** RPM = 60·f/p; real = reading × 2 / p (Intel 4-wire PWM fan spec rev 1.3 §2.1.3). */
export { rpmFromTachHz, rpmFromPulsePeriodMs, realRpmFromReading, readingFromRealRpm, STANDARD_TACH_PULSES_PER_REV } from "../tach/tach";
