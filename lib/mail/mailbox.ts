/// Reads the messages the development SMTP sink stored, newest first.
import { readdir, readFile } from "node:fs/promises";
import path from "node:path";
import type { StoredMessage } from "./message";

export function mailDir(): string {
  return process.env.RINGSIDE_MAIL_DIR ?? path.join(process.cwd(), ".data", "mail");
}

export async function listMessages(limit = 100, dir = mailDir()): Promise<StoredMessage[]> {
  let names: string[];
  try {
    names = (await readdir(dir)).filter((n) => n.endsWith(".json"));
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === "ENOENT") return [];
    throw error;
  }
  names.sort().reverse();
  const messages = await Promise.all(
    names.slice(0, limit).map(async (n) => JSON.parse(await readFile(path.join(dir, n), "utf8")) as StoredMessage),
  );
  return messages;
}
