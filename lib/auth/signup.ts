/// Account creation: validation, one transaction for the user row and its audit entry.
import { z } from "zod";
import { db } from "@/db/client";
import { users } from "@/db/schema";
import { HttpError } from "@/lib/http/errors";
import { recordAudit } from "./audit";
import { normalizeEmail } from "./options";
import { hashPassword, passwordProblem, PASSWORD_RULE } from "./password";
import type { CurrentUser } from "./types";

export const signUpBody = z.object({
  email: z.string().transform(normalizeEmail).pipe(z.email({ message: "not a valid e-mail address" }).max(254)),
  name: z.string().trim().min(1, { message: "is empty" }).max(100, { message: "is longer than 100 characters" }),
  password: z.string(),
});

export type SignUpInput = z.infer<typeof signUpBody>;

/// Throws HttpError 400 (weak password, with the rule) or 409 (e-mail taken).
export async function createAccount(input: SignUpInput, address: string): Promise<CurrentUser> {
  const problem = passwordProblem(input.password);
  if (problem) throw new HttpError(400, "weak_password", `${problem} ${PASSWORD_RULE}`);
  const passwordHash = await hashPassword(input.password);
  return db().transaction(async (tx) => {
    const [user] = await tx
      .insert(users)
      .values({ email: input.email, displayName: input.name, passwordHash })
      .onConflictDoNothing({ target: users.email })
      .returning({ id: users.id, email: users.email, displayName: users.displayName, siteRole: users.siteRole });
    if (!user) throw new HttpError(409, "email_taken", "An account with this e-mail address already exists.");
    await recordAudit(tx, { event: "signup", userId: user.id, email: user.email, address });
    return user;
  });
}
