import { SIGN_UP_ACCEPTED, signUp, signUpBody } from "@/lib/auth/signup";
import { readJson } from "@/lib/http/body";
import { clientAddress } from "@/lib/http/client-address";
import { route } from "@/lib/http/errors";
import { sendMail } from "@/lib/mail/send";
import { publicBase } from "@/lib/sharing/common";

/// 201 with the same body whether the address was free or already had an account (the
/// mailbox's owner is told which): the answer reveals no accounts.
export const POST = route(async (req) => {
  const input = await readJson(req, signUpBody, { limit: "authBodyBytes" });
  const mail = await signUp(input, clientAddress(req.headers), publicBase(req));
  // The answer is the same whether or not the mail goes out; the log says when it did not.
  await sendMail(mail).catch((error: Error) => console.error(`[ringside] sign-up mail failed: ${error.message}`));
  return Response.json({ user: { email: input.email, name: input.name }, message: SIGN_UP_ACCEPTED }, { status: 201 });
});
