/// Password policy and hashing (bcrypt).
import bcrypt from "bcryptjs";

/// bcrypt's work factor: 12 unless RINGSIDE_BCRYPT_COST (4–15) says otherwise; test.sh
/// lowers it so hundreds of sign-ins stay fast, which is common practice for test suites.
export function bcryptCost(): number {
  const wanted = Number(process.env.RINGSIDE_BCRYPT_COST ?? 12);
  return Number.isInteger(wanted) && wanted >= 4 && wanted <= 15 ? wanted : 12;
}
export const PASSWORD_RULE =
  "Passwords need at least 10 characters, including a letter and a digit, and at most 72 bytes.";

/// Returns why a password is too weak, or null when it satisfies PASSWORD_RULE.
/// bcrypt ignores everything past 72 bytes, so longer passwords are refused rather than truncated.
export function passwordProblem(password: string): string | null {
  if (password.length < 10) return "The password is shorter than 10 characters.";
  if (Buffer.byteLength(password, "utf8") > 72) return "The password is longer than 72 bytes.";
  if (!/\p{L}/u.test(password)) return "The password has no letter.";
  if (!/\p{Nd}/u.test(password)) return "The password has no digit.";
  return null;
}

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, bcryptCost());
}

export function verifyPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}

// A real hash of a random string, compared against when the account does not exist, so a
// wrong e-mail costs as much time as a wrong password.
let decoy: Promise<string> | undefined;
export function decoyHash(): Promise<string> {
  decoy ??= bcrypt.hash(`decoy-${Math.random()}`, bcryptCost());
  return decoy;
}
