/// A dry run of an upload (issue 15, the experiments room): the file is read exactly as
/// POST /api/experiments/uploads reads it (the same engine job), but nothing is stored; the
/// answer lists the first members and every bad line with its number and reason, so the
/// browser can show them before anything is created.
import { readUpload } from "./compute-adapter";
import type { UploadProblem } from "./experiment-job";
import { jsonLines, MAX_UPLOAD_LINES, tooManyLines } from "./uploads";

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

export async function previewUpload(u: { format: "text" | "json"; ring: string; content: string }): Promise<UploadPreview> {
  const unit = u.format === "json" ? "item" : "line";
  let text = u.content;
  let problems: UploadProblem[] = [];
  if (u.format === "json") ({ text, problems } = jsonLines(u.content));
  const lineCount = text.split("\n").length;
  if (lineCount > MAX_UPLOAD_LINES) throw tooManyLines(lineCount);
  if (problems.length === 0) {
    const read = await readUpload(u.ring, text);
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
