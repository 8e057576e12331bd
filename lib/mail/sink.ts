/// The development SMTP sink: accepts every message on 127.0.0.1 and stores it as a JSON
/// file in the mail folder, where the admin mailbox page (app/mailbox) reads it.
import { randomUUID } from "node:crypto";
import { mkdir, rename, writeFile } from "node:fs/promises";
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
    server.once("error", reject);
    server.listen(opts.port, "127.0.0.1", () => resolve(server));
  });
}

async function storeMessage(dir: string, message: StoredMessage): Promise<void> {
  await mkdir(dir, { recursive: true });
  const file = path.join(dir, `${message.id}.json`);
  // Written beside, then renamed, so a reader never sees half a message.
  await writeFile(`${file}.tmp`, JSON.stringify(message, null, 2));
  await rename(`${file}.tmp`, file);
}
