// Types of the validators scripts/compile-schemas.mjs generates into schema-validators.js.
import type { ErrorObject } from "ajv/dist/2020";

export interface CompiledValidator {
  (data: unknown): boolean;
  errors?: ErrorObject[] | null;
}

export const profile: CompiledValidator;
export const hardware: CompiledValidator;
