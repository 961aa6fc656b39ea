import "server-only";
import { dictionary } from "@zxcvbn-ts/language-common";
import { isCommonPassword } from "@/lib/auth/password-policy";

let list: Set<string> | undefined;

/** The shipped list of common and breached passwords (about 49,000, lower-cased), loaded once. */
export function commonPasswords(): ReadonlySet<string> {
  list ??= new Set(dictionary.passwords.map((p) => p.toLowerCase()));
  return list;
}

export function isCommon(password: string): boolean {
  return isCommonPassword(password, commonPasswords());
}
