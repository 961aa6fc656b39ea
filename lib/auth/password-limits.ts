/**
 * The length limits of a new password as plain values, for forms that show them without loading
 * the schema (lib/auth/password-policy.ts holds the rules and re-exports these).
 */

/** At least 12 characters (OWASP ASVS 4.0.3 V2.1.1). */
export const MIN_PASSWORD_CHARS = 12;
/**
 * bcrypt reads only the first 72 bytes of its input and silently ignores the rest; a longer
 * password would look accepted while only its start counts, so it is refused instead.
 */
export const MAX_PASSWORD_BYTES = 72;

export function utf8Length(s: string): number {
  return new TextEncoder().encode(s).byteLength;
}
