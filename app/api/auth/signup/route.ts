import { createAccount, signUpBody } from "@/lib/auth/signup";
import { readJson } from "@/lib/http/body";
import { clientAddress } from "@/lib/http/client-address";
import { route } from "@/lib/http/errors";
import { sendWelcome } from "@/lib/mail/send";

const MAX_BODY_BYTES = 8 * 1024;

export const POST = route(async (req) => {
  const input = await readJson(req, signUpBody, { maxBytes: MAX_BODY_BYTES });
  const user = await createAccount(input, clientAddress(req.headers));
  // The account exists whether or not the welcome mail goes out.
  await sendWelcome(user.email, user.displayName).catch((error: Error) =>
    console.error(`[ringside] welcome mail to a new account failed: ${error.message}`),
  );
  return Response.json({ user: { id: user.id, email: user.email, name: user.displayName, siteRole: user.siteRole } }, { status: 201 });
});
