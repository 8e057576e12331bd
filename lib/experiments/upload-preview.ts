/// A dry run of an upload (issue 15, the experiments room): the file is read exactly as
/// POST /api/experiments/uploads reads it (the same engine job), but nothing is stored; the
/// answer lists the first members and every bad line with its number and reason, so the
/// browser can show them before anything is created.
import { readUpload } from "./compute-adapter";
import { ExperimentError } from "./errors";
import type { UploadProblem } from "./experiment-job";
import { MAX_UPLOAD_LINES } from "./uploads";

/// How many members the preview returns (the count is always the full one).
export const PREVIEW_MEMBERS = 12;
/// How many problems are listed; the total is always given.
export const PREVIEW_PROBLEMS = 200;

export interface UploadPreview {
  /// members read (0 when any line is bad: the file is all or nothing)
  count: number;
  /// the first members' §9 encodings, each with the 1-based line (or JSON item) it came from
  members: { line: number; value: unknown }[];
  problems: { line: number; message: string }[];
  problemCount: number;
  /// "line" for text files, "item" for JSON lists
  unit: "line" | "item";
}

/// The same reading of JSON as uploads.ts: one `<g1, g2>` line per item; a malformed item
/// is a problem numbered by its 1-based position.
function jsonAsLines(content: string): { text: string; problems: UploadProblem[] } {
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

export async function previewUpload(u: { format: "text" | "json"; ring: string; content: string }): Promise<UploadPreview> {
  const unit = u.format === "json" ? "item" : "line";
  let text = u.content;
  let problems: UploadProblem[] = [];
  if (u.format === "json") ({ text, problems } = jsonAsLines(u.content));
  const lineCount = text.split("\n").length;
  if (lineCount > MAX_UPLOAD_LINES)
    throw new ExperimentError(413, "too_large", `The upload has ${lineCount} lines; at most ${MAX_UPLOAD_LINES}.`);
  if (problems.length === 0) {
    const read = await readUpload(u.ring, text, 60_000);
    if (read.kind === "upload-error") problems = read.problems;
    else {
      return {
        count: read.members.length,
        // the job's lines are 1-based lines of the file (line 0 is the ring)
        members: read.members.slice(0, PREVIEW_MEMBERS).map((value, k) => ({ line: read.lines[k] ?? k + 1, value })),
        problems: [],
        problemCount: 0,
        unit,
      };
    }
  }
  problems.sort((a, b) => a.line - b.line);
  return {
    count: 0,
    members: [],
    problems: problems.slice(0, PREVIEW_PROBLEMS).map((p) => ({ line: p.line, message: p.message })),
    problemCount: problems.length,
    unit,
  };
}
