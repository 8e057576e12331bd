/// A dry run of an upload (issue 15, the experiments room): the file is read by the upload's
/// own reader (`readFamilyFile` in uploads.ts, the same engine job), but nothing is stored;
/// the answer lists the first members and every bad line with its number and reason, so the
/// browser can show them before anything is created.
import { readFamilyFile, type FamilyFile } from "./uploads";

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

export async function previewUpload(u: FamilyFile): Promise<UploadPreview> {
  const unit = u.format === "json" ? "item" : "line";
  const read = await readFamilyFile(u);
  if (read.kind === "upload-error") {
    return {
      count: 0,
      members: [],
      problems: read.problems.slice(0, PREVIEW_PROBLEMS).map((p) => ({ line: p.line, message: p.message })),
      problemCount: read.problems.length,
      unit,
    };
  }
  return {
    count: read.members.length,
    // the job's lines are 1-based lines of the file (line 0 is the ring)
    members: read.members.slice(0, PREVIEW_MEMBERS).map((value, k) => ({ line: read.lines[k] ?? k + 1, value })),
    problems: [],
    problemCount: 0,
    unit,
  };
}
