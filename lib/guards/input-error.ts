/**
 * Thrown by computations (operating point, transient, encoder…) when a caller
 * passes a number outside the range the computation is defined for. The
 * message names the parameter and how to fix it. Validation and decoders never
 * throw; they return issues instead.
 */
export class EngineInputError extends RangeError {
  constructor(
    readonly parameter: string,
    message: string,
  ) {
    super(`${parameter}: ${message}`);
    this.name = "EngineInputError";
  }
}

/** Throws EngineInputError unless `value` is a finite number within [min, max]. */
export function requireFinite(parameter: string, value: unknown, min = -Infinity, max = Infinity): number {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new EngineInputError(parameter, `expected a finite number, got ${describe(value)}`);
  }
  if (value < min || value > max) {
    throw new EngineInputError(parameter, `${value} is outside ${min} to ${max}`);
  }
  return value;
}

function describe(value: unknown): string {
  if (typeof value === "number") return String(value);
  if (value === null) return "null";
  return typeof value;
}
