/**
 * Password rules (OWASP ASVS 4.0.3 V2.1): at least 12 characters, any characters allowed,
 * no composition rules; refused when bcrypt could not hold it whole, when it is one character
 * repeated, or when it is on a list of common and breached passwords shipped with the app
 * (the password list of the `@zxcvbn-ts/language-common` package, checked on the server).
 */
import { z } from "zod";
import { MAX_PASSWORD_BYTES, MIN_PASSWORD_CHARS, utf8Length } from "./password-limits";

export { MIN_PASSWORD_CHARS, MAX_PASSWORD_BYTES, utf8Length };

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
