import "server-only";
import bcrypt from "bcryptjs";

const COST = 10;

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, COST);
}

export function verifyPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}

// A real hash of a random string: comparing against it costs what a real check costs,
// so the time taken does not tell whether an e-mail address has an account.
const DECOY_HASH = "$2b$10$4Ui3AhPR60igBXiVbDBNOe38aTYXgYAkvH3OhfrycL80bRGE23Jdy";

export async function spendPasswordCheckTime(password: string): Promise<void> {
  await bcrypt.compare(password, DECOY_HASH);
}
