/// Outgoing mail through SMTP; in development and tests that is the local sink.
import nodemailer from "nodemailer";

const FROM = "Ringside <no-reply@ringside.invalid>";

function transport() {
  const port = Number(process.env.RINGSIDE_SMTP_PORT ?? 2525);
  const host = process.env.RINGSIDE_SMTP_HOST ?? "127.0.0.1";
  return nodemailer.createTransport({ host, port, secure: false, ignoreTLS: true });
}

export async function sendMail(message: { to: string; subject: string; text: string }): Promise<void> {
  await transport().sendMail({ from: FROM, ...message });
}

export function sendWelcome(to: string, name: string): Promise<void> {
  return sendMail({
    to,
    subject: "Welcome to Ringside",
    text:
      `Hello ${name},\n\n` +
      "your Ringside account is ready. Sign in with this e-mail address and the password you chose.\n\n" +
      "Ringside\n",
  });
}
