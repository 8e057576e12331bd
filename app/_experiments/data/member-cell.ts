/// The program of the cell "Open in a session" adds: the member's ring and the member,
/// named, with a comment saying where they came from. Pure function.
import type { ValueReading as ValueJson } from "@/lib/wire/reading";
import type { Experiment } from "../types";

export function memberCellSource(e: Experiment, index: number, member: ValueJson): string {
  const lines = [
    `# member ${index} of the experiment "${e.title.replace(/[\r\n]+/g, " ")}" (${e.familyDefinition.replace(/[\r\n]+/g, " ")})`,
  ];
  const name = `m${index}`;
  if (member.type === "Ideal" && member.ring?.text) {
    lines.push(`S := ${member.ring.text}`, `${name} := ${member.text}`);
  } else {
    lines.push(`${name} := ${member.text}`);
  }
  return lines.join("\n");
}
