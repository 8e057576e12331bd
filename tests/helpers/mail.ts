/// Reading what the test SMTP sink stored: waiting (bounded) for a message, and following
/// the confirmation link of a new account's welcome mail.
import { listMessages } from "@/lib/mail/mailbox";
import type { StoredMessage } from "@/lib/mail/message";
import { testEnv } from "./env";
import type { TestClient } from "./http";

export async function waitForMail(to: string, match: (m: StoredMessage) => boolean = () => true): Promise<StoredMessage> {
  for (let i = 0; i < 50; i++) {
    const found = (await listMessages(500, testEnv("RINGSIDE_MAIL_DIR"))).find(
      (m) => (m.envelopeTo.includes(to) || m.to.includes(to)) && match(m),
    );
    if (found) return found;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no matching mail to ${to} reached the sink`);
}

/// The /verify-email link in the welcome mail to `email`.
export async function verificationLinkFor(email: string): Promise<string> {
  const mail = await waitForMail(email, (m) => m.subject === "Welcome to Ringside");
  const link = /https?:\/\/\S+\/verify-email\?token=\S+/.exec(mail.text)?.[0];
  if (!link) throw new Error(`the welcome mail to ${email} has no confirmation link`);
  return link;
}

/// Opens the confirmation link as the mailbox's owner would; the page says it worked.
export async function confirmAddress(client: TestClient, email: string): Promise<void> {
  const link = new URL(await verificationLinkFor(email));
  const page = await client.request(`${link.pathname}${link.search}`);
  const html = await page.text();
  if (page.status !== 200 || !html.includes("Address confirmed")) throw new Error(`confirming ${email} failed (HTTP ${page.status})`);
}
