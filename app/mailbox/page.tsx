import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { currentUser } from "@/lib/auth/current-user";
import { listMessages } from "@/lib/mail/mailbox";
import { LinkedText } from "./linked-text";

export const metadata: Metadata = { title: "Mailbox · Ringside" };

/// Messages caught by the local SMTP sink, for site admins (development and tests only
/// deliver there).
export default async function MailboxPage() {
  const user = await currentUser();
  if (!user) redirect("/sign-in?callbackUrl=/mailbox");
  if (user.siteRole !== "admin") {
    return (
      <main className="mx-auto max-w-2xl p-8">
        <h1 className="text-lg font-semibold">Mailbox</h1>
        <p role="alert" className="mt-2 text-ink-soft">
          The mailbox is for site admins; your account has the site role {user.siteRole}.
        </p>
      </main>
    );
  }
  const messages = await listMessages();
  return (
    <main className="mx-auto max-w-3xl p-8">
      <div className="flex items-baseline justify-between">
        <h1 className="text-lg font-semibold">Mailbox</h1>
        <Link href="/" className="text-sm text-ink-soft underline">
          Back to the console
        </Link>
      </div>
      <p className="mt-1 text-sm text-ink-soft">Every message sent through the local SMTP sink, newest first.</p>
      {messages.length === 0 ? (
        <p className="mt-6 text-ink-soft">No messages yet.</p>
      ) : (
        <ul className="mt-6 space-y-4">
          {messages.map((m) => (
            <li key={m.id} className="rounded-lg border border-ink/10 bg-white p-4">
              <p className="font-medium">{m.subject || "(no subject)"}</p>
              <p className="text-sm text-ink-soft">
                to {m.envelopeTo.join(", ")} · {new Date(m.receivedAt).toUTCString()}
              </p>
              <pre className="mt-2 whitespace-pre-wrap font-mono text-sm">
                <LinkedText text={m.text} />
              </pre>
            </li>
          ))}
        </ul>
      )}
    </main>
  );
}
