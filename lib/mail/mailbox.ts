/// Reads the messages the development SMTP sink stored, newest first.
import { readdir, readFile } from "node:fs/promises";
import path from "node:path";
import type { StoredMessage } from "./message";

export function mailDir(): string {
  return process.env.RINGSIDE_MAIL_DIR ?? path.join(/*turbopackIgnore: true*/ process.cwd(), ".data", "mail");
}

// The folder is only known at run time; the turbopackIgnore hints keep the build from
// tracing the whole project into the server output because of these reads.
export async function listMessages(limit = 100, dir = mailDir()): Promise<StoredMessage[]> {
  let names: string[];
  try {
    names = (await readdir(/*turbopackIgnore: true*/ dir)).filter((n) => n.endsWith(".json"));
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === "ENOENT") return [];
    throw error;
  }
  names.sort().reverse();
  return Promise.all(
    names.slice(0, limit).map(async (n) => {
      const file = path.join(/*turbopackIgnore: true*/ dir, n);
      return JSON.parse(await readFile(/*turbopackIgnore: true*/ file, "utf8")) as StoredMessage;
    }),
  );
}
