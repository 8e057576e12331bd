/// The development SMTP sink: accepts every message on 127.0.0.1 and stores it as a JSON
/// file in the mail folder, where the admin mailbox page (app/mailbox) reads it.
import { randomUUID } from "node:crypto";
import { chmod, mkdir, readdir, rename, writeFile } from "node:fs/promises";
import path from "node:path";
import { SMTPServer } from "smtp-server";
import { parseRawMessage, type StoredMessage } from "./message";

const MAX_MESSAGE_BYTES = 5 * 1024 * 1024;

export function startMailSink(opts: { port: number; dir: string }): Promise<SMTPServer> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS", "AUTH"],
    size: MAX_MESSAGE_BYTES,
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on("data", (chunk: Buffer) => chunks.push(chunk));
      stream.on("end", () => {
        if ((stream as unknown as { sizeExceeded?: boolean }).sizeExceeded) {
          callback(Object.assign(new Error("message exceeds the sink's size limit"), { responseCode: 552 }));
          return;
        }
        const raw = Buffer.concat(chunks).toString("utf8");
        const { headers, body } = parseRawMessage(raw);
        const message: StoredMessage = {
          id: `${Date.now()}-${randomUUID()}`,
          receivedAt: new Date().toISOString(),
          envelopeFrom: session.envelope.mailFrom ? session.envelope.mailFrom.address : null,
          envelopeTo: session.envelope.rcptTo.map((r) => r.address),
          subject: headers.get("subject") ?? "",
          from: headers.get("from") ?? "",
          to: headers.get("to") ?? "",
          text: body,
        };
        storeMessage(opts.dir, message).then(
          () => callback(),
          (error: Error) => callback(error),
        );
      });
    },
  });
  return new Promise((resolve, reject) => {
    // A folder (and messages) left from an older version may be readable by others: close
    // them at start.
    mkdir(opts.dir, { recursive: true, mode: 0o700 })
      .then(() => chmod(opts.dir, 0o700))
      .then(() => readdir(opts.dir))
      .then((names) => Promise.all(names.map((n) => chmod(path.join(opts.dir, n), 0o600))))
      .catch((error: Error) => console.error(`[ringside] cannot make the mail folder private: ${error.message}`));
    server.once("error", reject);
    server.listen(opts.port, "127.0.0.1", () => resolve(server));
  });
}

/// Messages hold sign-up and invitation links, which are as good as passwords: the folder
/// is readable by its owner only (700) and so is every message (600), whatever the umask.
async function storeMessage(dir: string, message: StoredMessage): Promise<void> {
  await mkdir(dir, { recursive: true, mode: 0o700 });
  await chmod(dir, 0o700);
  const file = path.join(dir, `${message.id}.json`);
  // Written beside, then renamed, so a reader never sees half a message.
  await writeFile(`${file}.tmp`, JSON.stringify(message, null, 2), { mode: 0o600 });
  await chmod(`${file}.tmp`, 0o600);
  await rename(`${file}.tmp`, file);
}
