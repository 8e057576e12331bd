/// Password policy and hashing (bcrypt).
import bcrypt from "bcryptjs";
import { ZxcvbnFactory } from "@zxcvbn-ts/core";
import * as zxcvbnCommon from "@zxcvbn-ts/language-common";
import * as zxcvbnEn from "@zxcvbn-ts/language-en";
import { withHashSlot } from "./hash-slots";

/// bcrypt's work factor: 12 unless RINGSIDE_BCRYPT_COST (4–15) says otherwise; test.sh
/// lowers it so hundreds of sign-ins stay fast, which is common practice for test suites.
export function bcryptCost(): number {
  const wanted = Number(process.env.RINGSIDE_BCRYPT_COST ?? 12);
  return Number.isInteger(wanted) && wanted >= 4 && wanted <= 15 ? wanted : 12;
}

export const MIN_PASSWORD_LENGTH = 10;
/// zxcvbn's score runs from 0 (guessable in under 10³ guesses) to 4 (over 10¹⁰); 3 means
/// "safely unguessable: moderate protection from offline slow-hash scenario" (Wheeler,
/// "zxcvbn: Low-Budget Password Strength Estimation", USENIX Security 2016, §3).
export const MIN_PASSWORD_SCORE = 3;

export const PASSWORD_RULE =
  `Passwords need at least ${MIN_PASSWORD_LENGTH} characters and at most 72 bytes, and must not be easy to guess ` +
  `(common words, names, keyboard patterns, dates and repetitions are easy to guess; several unrelated words are not).`;

let estimator: ZxcvbnFactory | undefined;
function strength(): ZxcvbnFactory {
  estimator ??= new ZxcvbnFactory({
    translations: zxcvbnEn.translations,
    graphs: zxcvbnCommon.adjacencyGraphs,
    dictionary: { ...zxcvbnCommon.dictionary, ...zxcvbnEn.dictionary },
  });
  return estimator;
}

/// Returns why a password is too weak, or null when it satisfies PASSWORD_RULE. `context`
/// (the e-mail address and name of the account) counts as easy to guess.
/// bcrypt ignores everything past 72 bytes, so longer passwords are refused rather than truncated.
export function passwordProblem(password: string, context: readonly string[] = []): string | null {
  if (password.length < MIN_PASSWORD_LENGTH) return `The password is shorter than ${MIN_PASSWORD_LENGTH} characters.`;
  if (Buffer.byteLength(password, "utf8") > 72) return "The password is longer than 72 bytes.";
  const inputs = context.flatMap((c) => [c, ...c.split(/[@.\s_-]+/)]).filter((c) => c.length >= 3);
  const result = strength().check(password, inputs);
  if (result.score >= MIN_PASSWORD_SCORE) return null;
  const why = [result.feedback.warning, ...result.feedback.suggestions].filter((s): s is string => Boolean(s));
  return `The password is too easy to guess (strength ${result.score} of 4, at least ${MIN_PASSWORD_SCORE} needed)${why.length > 0 ? `: ${why.join(" ")}` : "."}`;
}

export function hashPassword(password: string): Promise<string> {
  return withHashSlot(() => bcrypt.hash(password, bcryptCost()));
}

export function verifyPassword(password: string, hash: string): Promise<boolean> {
  return withHashSlot(() => bcrypt.compare(password, hash));
}

// A real hash of a random string, compared against when the account does not exist, so a
// wrong e-mail costs as much time as a wrong password.
let decoy: Promise<string> | undefined;
export function decoyHash(): Promise<string> {
  decoy ??= bcrypt.hash(`decoy-${Math.random()}`, bcryptCost());
  return decoy;
}
