/// The one list the library and "Shared with me" both draw (app/_console/views/object-copy-list.tsx)
/// and its copy rules (app/_console/state/copy-object.ts): rows marked with the object's name,
/// the verb's button named for the row (none where I may not edit), an empty list's words, and
/// a name already taken turning into a renaming that suggests name_copy.
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { ApiError } from "@/app/_client/fetch";
import { afterCopyFailure, copyNameProblem } from "@/app/_console/state/copy-object";
import { ObjectCopyList, type CopyRow, type ObjectCopyListProps } from "@/app/_console/views/object-copy-list";

type Row = CopyRow & { sessionTitle: string };
const rows: Row[] = [
  { id: "a", name: "J", type: "ideal", where: "in “Harbor”", detail: "J := <x^2, x*y>", sessionTitle: "Harbor" },
  { id: "b", name: "R", type: "ring", where: "in “Dock” · by Ana", detail: "R := S / J", sessionTitle: "Dock" },
];

function html(over: Partial<ObjectCopyListProps<Row>> = {}): string {
  const props: ObjectCopyListProps<Row> = {
    rows,
    label: "Library",
    verb: "Insert",
    buttonName: (r) => `Insert ${r.name} from ${r.sessionTitle}`,
    rowAttribute: "data-library-object",
    empty: "Nothing matches.",
    targetSessionId: "00000000-0000-4000-8000-000000000001",
    noticeFor: (r, copied) => `Inserted ${copied}`,
    onCopied: () => {},
    ...over,
  };
  return renderToStaticMarkup(createElement(ObjectCopyList<Row>, props));
}

describe("ObjectCopyList", () => {
  it("draws one row per object, marked with its name, with the verb's button named for the row", () => {
    const h = html();
    expect(h).toContain('aria-label="Library"');
    expect(h.match(/<li /g)).toHaveLength(2);
    expect(h).toContain('data-library-object="J"');
    expect(h).toContain('data-library-object="R"');
    expect(h).toContain('aria-label="Insert J from Harbor"');
    expect(h).toContain('aria-label="Insert R from Dock"');
    expect(h).toContain("in “Dock” · by Ana");
    expect(h).toContain('title="R := S / J"');
  });

  it("serves the shared-objects dialog with its own words and row marks", () => {
    const h = html({
      label: "Objects shared with me",
      verb: "Import",
      buttonName: (r) => `Import ${r.name}`,
      rowAttribute: "data-shared-object",
    });
    expect(h).toContain('data-shared-object="J"');
    expect(h).not.toContain("data-library-object");
    expect(h).toContain('aria-label="Import J"');
    expect(h).toMatch(/>Import<\/button>/);
  });

  it("offers no button without a session I may edit, and says so when there is nothing", () => {
    expect(html({ targetSessionId: null })).not.toContain("<button");
    const empty = html({ rows: [] });
    expect(empty).toContain("Nothing matches.");
    expect(empty).not.toContain("<ul");
  });
});

describe("copy rules", () => {
  it("a copy's name is an identifier", () => {
    expect(copyNameProblem("J_copy")).toBeNull();
    expect(copyNameProblem("J'")).toBeNull();
    expect(copyNameProblem("2J")).toMatch(/starts with a letter/);
    expect(copyNameProblem("J copy")).toMatch(/only letters, digits/);
  });

  it("a name already taken asks for another, suggesting name_copy; any other failure only says why", () => {
    expect(afterCopyFailure("J", new ApiError(409, "name_taken", "J is already defined in this session."))).toEqual({
      rename: "J_copy",
      problem: "J is already defined in this session.",
    });
    expect(afterCopyFailure("J", new ApiError(403, "forbidden", "read-only"))).toEqual({ rename: null, problem: "read-only" });
    expect(afterCopyFailure("J", "offline")).toEqual({ rename: null, problem: "offline" });
  });
});
