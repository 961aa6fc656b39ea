import "server-only";
import bcrypt from "bcryptjs";

const COST = 10;

export function hashPassword(plain: string): Promise<string> {
  return bcrypt.hash(plain, COST);
}

export function verifyPassword(plain: string, hash: string): Promise<boolean> {
  return bcrypt.compare(plain, hash);
}

// Compared against when the account does not exist, so a miss costs the same time as a hit.
const DUMMY_HASH = bcrypt.hashSync("loopkeeper-no-such-account", COST);
export function burnPasswordCheck(plain: string): Promise<boolean> {
  return bcrypt.compare(plain, DUMMY_HASH);
}
