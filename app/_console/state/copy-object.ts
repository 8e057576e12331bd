/// Copying a named object of another session into the open one (the library's "Insert" and
/// "Shared with me"'s "Import"): what a chosen name must look like, and what a refused copy
/// turns into — a name already used in the session asks for another, suggesting `name_copy`.
import { ApiError, messageOf } from "@/app/_client/fetch";

const NAME = /^[A-Za-z][A-Za-z0-9_']*$/;

/// Why `name` cannot name the copy, or null when it can.
export const copyNameProblem = (name: string): string | null =>
  NAME.test(name) ? null : "A name starts with a letter and has only letters, digits, _ and '.";

/// After a copy failed: the name to offer (null: no renaming, the copy simply failed) and the
/// problem to show.
export function afterCopyFailure(objectName: string, error: unknown): { rename: string | null; problem: string } {
  if (error instanceof ApiError && error.code === "name_taken") return { rename: `${objectName}_copy`, problem: error.message };
  return { rename: null, problem: messageOf(error) };
}
