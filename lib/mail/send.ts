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
