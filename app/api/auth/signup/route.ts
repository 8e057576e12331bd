import { SIGN_UP_ACCEPTED, signUp, signUpBody } from "@/lib/auth/signup";
import { readJson } from "@/lib/http/body";
import { clientAddress } from "@/lib/http/client-address";
import { route } from "@/lib/http/errors";
import { publicBase } from "@/lib/sharing/common";

const MAX_BODY_BYTES = 8 * 1024;

/// 201 with the same body whether the address was free or already had an account (the
/// mailbox's owner is told which): the answer reveals no accounts.
export const POST = route(async (req) => {
  const input = await readJson(req, signUpBody, { maxBytes: MAX_BODY_BYTES });
  await signUp(input, clientAddress(req.headers), publicBase(req));
  return Response.json({ user: { email: input.email, name: input.name }, message: SIGN_UP_ACCEPTED }, { status: 201 });
});
