/// Account creation: validation, one transaction for the user row, its audit entry and its
/// e-mail verification token. The answer never says whether the address already had an
/// account: both cases answer alike, and the mailbox owner learns which case it was.
import { z } from "zod";
import { db } from "@/db/client";
import { users } from "@/db/schema";
import { HttpError, limitError } from "@/lib/http/errors";
import { atMost, formatLimit } from "@/lib/limits";
import { recordAudit } from "./audit";
import { issueVerificationToken, VERIFICATION_LIFETIME_MS, verificationLink } from "./email-verification";
import { HASH_QUEUE_FULL_MESSAGE, HASH_RETRY_AFTER_SECONDS, isHashQueueFull } from "./hash-slots";
import { normalizeEmail } from "./options";
import { hashPassword, passwordProblem, PASSWORD_RULE } from "./password";

export const signUpBody = z.object({
  email: z
    .string()
    .transform(normalizeEmail)
    .pipe(z.email({ message: "not a valid e-mail address" }).max(254)),
  name: z
    .string()
    .trim()
    .min(1, { message: "is empty" })
    .max(...atMost("displayNameChars")),
  password: z.string(),
});

export type SignUpInput = z.infer<typeof signUpBody>;

/// How long the mailed link works, for people: "48 h" (the limit `emailVerificationMs`).
export const VERIFICATION_LIFETIME_TEXT = formatLimit("emailVerificationMs", VERIFICATION_LIFETIME_MS);

/// What every sign-up with a valid body and an acceptable password answers, and what the
/// sign-up page shows after it: the account is not confirmed until the mailed link is followed.
export const SIGN_UP_ACCEPTED =
  `Check your mail: we sent a link to this address that confirms it, and it works for ${VERIFICATION_LIFETIME_TEXT}. ` +
  "Until you follow it you can work in your own sessions, but you cannot accept team invitations " +
  "and sessions shared with this address wait for you.";

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
}

/// Throws HttpError 400 (weak password, with the rule) or 503 (too many password checks at
/// once). Creates the account and returns the welcome mail with its confirmation link, or,
/// when the address is taken, a notice to its owner instead; the route sends either and
/// answers alike, so the caller cannot tell the two apart.
export async function signUp(input: SignUpInput, address: string, base: string): Promise<OutgoingMail> {
  const problem = passwordProblem(input.password, [input.email, input.name]);
  if (problem) throw new HttpError(400, "weak_password", `${problem} ${PASSWORD_RULE}`);
  let passwordHash: string;
  try {
    // Hashed in both cases, so the answer takes as long whether or not the address is taken.
    passwordHash = await hashPassword(input.password);
  } catch (error) {
    if (isHashQueueFull(error))
      throw limitError(503, "busy", "hashQueue", HASH_QUEUE_FULL_MESSAGE, { "Retry-After": String(HASH_RETRY_AFTER_SECONDS) });
    throw error;
  }
  const created = await db().transaction(async (tx) => {
    const [user] = await tx
      .insert(users)
      .values({ email: input.email, displayName: input.name, passwordHash, emailVerifiedAt: null })
      .onConflictDoNothing({ target: users.email })
      .returning({ id: users.id, email: users.email, displayName: users.displayName });
    if (!user) {
      await recordAudit(tx, { event: "signup_address_taken", email: input.email, address });
      return null;
    }
    await recordAudit(tx, { event: "signup", userId: user.id, email: user.email, address });
    return { user, token: await issueVerificationToken(tx, user.id) };
  });
  return created ? welcomeMail(input.email, input.name, verificationLink(base, created.token)) : takenMail(input.email, base);
}

function welcomeMail(to: string, name: string, link: string): OutgoingMail {
  return {
    to,
    subject: "Welcome to Ringside",
    text:
      `Hello ${name},\n\n` +
      "your Ringside account is ready. Sign in with this e-mail address and the password you chose.\n\n" +
      `Before teams can invite you or colleagues can share with you, confirm that this address is yours:\n${link}\n\n` +
      `The link works for ${VERIFICATION_LIFETIME_TEXT}. If you did not create this account, ignore this message.\n\n` +
      "Ringside\n",
  };
}

function takenMail(to: string, base: string): OutgoingMail {
  return {
    to,
    subject: "Someone tried to create a Ringside account with your address",
    text:
      "Hello,\n\n" +
      "someone tried to create a Ringside account with this e-mail address, which already has one; nothing was changed.\n" +
      `If it was you, sign in at ${base}/sign-in instead.\n\n` +
      "Ringside\n",
  };
}
