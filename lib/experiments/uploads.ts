/// Families uploaded as files: plain text (one ideal per line in the notation, blank lines and
/// # comments allowed) or JSON (a list of lists of generator texts). Every line is read in the
/// given ring by the notation's checker and evaluator; when any line is bad, every problem is
/// reported with its line number (or JSON item) and nothing is stored.
import type { z } from "zod";
import type { FamilyFileBody } from "@/lib/wire/experiments";
import { db } from "@/db/client";
import { namedObjects, uploads } from "@/db/schema";
import { formatLimit, limitDetails, limitValue } from "@/lib/limits";
import { ExperimentError } from "./errors";
import { readUpload } from "./compute-adapter";
import type { UploadOutcome, UploadProblem } from "./experiment-job";

/// Lines (or JSON items) an upload may have: the limit `uploadLines` of lib/limits.ts.
export const MAX_UPLOAD_LINES = limitValue("uploadLines");

/// The 413 of an upload with too many lines, kind `limit` naming `uploadLines`.
export function tooManyLines(lineCount: number): ExperimentError {
  return new ExperimentError(
    413,
    "too_large",
    `The upload has ${lineCount} lines; at most ${formatLimit("uploadLines", MAX_UPLOAD_LINES)} (limit uploadLines).`,
    limitDetails("uploadLines", MAX_UPLOAD_LINES),
  );
}

/// A family file as the browser sends it, for the preview and for the upload alike.
export type FamilyFile = z.infer<typeof FamilyFileBody>;

export interface UploadInput extends FamilyFile {
  sessionId: string;
  userId: string;
  /// the named object the family becomes (an identifier)
  name: string;
}

/// JSON content as text lines `<g1, g2>`, one per item; a malformed item is a problem.
export function jsonLines(content: string): { text: string; problems: UploadProblem[] } {
  let data: unknown;
  try {
    data = JSON.parse(content);
  } catch (e) {
    throw new ExperimentError(400, "invalid_upload", `The upload is not valid JSON: ${(e as Error).message}.`);
  }
  if (!Array.isArray(data))
    throw new ExperimentError(
      400,
      "invalid_upload",
      'A JSON upload is a list of ideals, each a list of generator texts: [["x^2", "y"], …].',
    );
  const problems: UploadProblem[] = [];
  const lines = data.map((item, k) => {
    if (!Array.isArray(item) || item.length === 0 || !item.every((g) => typeof g === "string" && g.trim() !== "" && !/[<>\n;]/.test(g))) {
      problems.push({ line: k + 1, message: 'expected a nonempty list of generator texts such as ["x^2", "y*z"]' });
      return "<0>";
    }
    return `<${(item as string[]).join(", ")}>`;
  });
  return { text: lines.join("\n"), problems };
}

/// Reads a family file the one way both the upload and its preview (upload-preview.ts) read
/// it: JSON items become text lines (a malformed item is a problem), more than
/// MAX_UPLOAD_LINES lines are refused (413), and only a file with no problem so far goes to
/// an engine thread, which reads every line in the ring. Problems come back in line order.
export async function readFamilyFile(u: FamilyFile): Promise<UploadOutcome> {
  let text = u.content;
  let problems: UploadProblem[] = [];
  if (u.format === "json") ({ text, problems } = jsonLines(u.content));
  const lineCount = text.split("\n").length;
  if (lineCount > MAX_UPLOAD_LINES) throw tooManyLines(lineCount);
  if (problems.length === 0) {
    const read = await readUpload(u.ring, text);
    if (read.kind === "upload") return read;
    problems = read.problems;
  }
  return { kind: "upload-error", problems: [...problems].sort((a, b) => a.line - b.line) };
}

const where = (format: "text" | "json", p: UploadProblem) =>
  p.line === 0 ? p.message : `${format === "json" ? "item" : "line"} ${p.line}: ${p.message}`;

export async function createUpload(u: UploadInput) {
  if (!/^[A-Za-z][A-Za-z0-9_']*$/.test(u.name))
    throw new ExperimentError(
      400,
      "invalid_upload",
      `The name ${JSON.stringify(u.name)} is not an identifier (a letter, then letters, digits, _ or ').`,
    );
  const read = await readFamilyFile(u);
  if (read.kind === "upload-error") {
    const problems = read.problems;
    const shown = problems.slice(0, 20).map((p) => where(u.format, p));
    throw new ExperimentError(
      422,
      "invalid_upload",
      `Nothing was stored: ${shown[0]}${problems.length > 1 ? ` (and ${problems.length - 1} more problem${problems.length > 2 ? "s" : ""})` : ""}`,
      problems.slice(0, 100).map((p) => ({ line: p.line, message: where(u.format, p) })),
    );
  }
  const family = {
    type: "Family",
    text: `upload ${u.name}: ${read.members.length} ideals`,
    length: read.members.length,
    definition: `upload ${u.name} (${u.format}, ${read.members.length} ideals over ${u.ring})`,
    generator: "upload",
    options: { length: String(read.members.length) },
    members: read.members,
    ring: read.ring,
  };
  return db().transaction(async (tx) => {
    const [row] = await tx
      .insert(uploads)
      .values({
        sessionId: u.sessionId,
        createdBy: u.userId,
        name: u.name,
        format: u.format,
        content: u.content,
        family,
        length: read.members.length,
      })
      .returning({ id: uploads.id, name: uploads.name, format: uploads.format, length: uploads.length, createdAt: uploads.createdAt });
    // the upload becomes a named object of type Family (notation.md §11)
    await tx
      .insert(namedObjects)
      .values({
        sessionId: u.sessionId,
        ownerId: u.userId,
        name: u.name,
        type: "Family",
        value: family,
        source: `# uploaded file (${u.format})`,
      })
      .onConflictDoUpdate({
        target: [namedObjects.sessionId, namedObjects.name],
        set: { type: "Family", value: family, source: `# uploaded file (${u.format})`, updatedAt: new Date() },
      });
    return row;
  });
}
