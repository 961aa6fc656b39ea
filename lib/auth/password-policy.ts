import { z } from "zod";

/**
 * Password rules (OWASP ASVS 4.0.3 V2.1): at least 12 characters, any characters allowed,
 * no composition rules; refused when bcrypt could not hold it whole, when it is one character
 * repeated, or when it is on a list of common and breached passwords shipped with the app
 * (the password list of the `@zxcvbn-ts/language-common` package, checked on the server).
 */
export const MIN_PASSWORD_CHARS = 12;
/**
 * bcrypt reads only the first 72 bytes of its input and silently ignores the rest; a longer
 * password would look accepted while only its start counts, so it is refused instead.
 */
export const MAX_PASSWORD_BYTES = 72;

export function utf8Length(s: string): number {
  return new TextEncoder().encode(s).byteLength;
}

/** The rules every new password meets, usable in forms and on the server. */
export const newPasswordSchema = z
  .string()
  .min(MIN_PASSWORD_CHARS, `Use at least ${MIN_PASSWORD_CHARS} characters.`)
  .refine((p) => utf8Length(p) <= MAX_PASSWORD_BYTES, `Use at most ${MAX_PASSWORD_BYTES} bytes (about ${MAX_PASSWORD_BYTES} plain letters; accented letters and symbols count 2–4): longer passwords cannot be stored whole.`)
  .refine((p) => !/^(.)\1*$/su.test(p), "A password made of one repeated character is too easy to guess.");

/** True when the password (compared without case) is on the shipped list. */
export function isCommonPassword(password: string, commonList: ReadonlySet<string>): boolean {
  return commonList.has(password.toLowerCase());
}
