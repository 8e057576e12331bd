/// What an exporter must say beside a value so that a reader of the paper is not misled:
/// the value's own note (a bound that cut a resolution, a random choice behind a Burch
/// index) and, for a power series, whether its rational function is a guess. The value's
/// `text` already carries these words, but glued to the value; typeset output needs the
/// mathematics and the words apart.
import type { ValueJsonLike } from "./transcript";

const str = (x: unknown): string | undefined => (typeof x === "string" && x !== "" ? x : undefined);
const strings = (x: unknown): string[] => (Array.isArray(x) ? x.filter((s): s is string => typeof s === "string") : []);

/// The plain mathematical text of an Int, Rat or Poly, without the note its `text` may carry.
export function plainText(v: ValueJsonLike): string {
  if ((v.type === "Int" || v.type === "Rat") && str(v.value)) return v.value as string;
  // a HilbertSeries text ends with " (note)" when it has a note; the note is exported apart
  if (v.type === "HilbertSeries" && str(v.note) && v.text.endsWith(` (${v.note})`)) return v.text.slice(0, -(v.note as string).length - 3);
  return v.text;
}

/// c0 + c1*t + … + O(t^n) in the notation's own polynomial syntax.
export function seriesPrefixText(coefficients: readonly string[]): string {
  const terms: string[] = [];
  coefficients.forEach((c, i) => {
    if (c === "0") return;
    const power = i === 0 ? "" : i === 1 ? "t" : `t^${i}`;
    const coeff = power === "" ? c : c === "1" ? "" : c === "-1" ? "-" : `${c}*`;
    terms.push(`${coeff}${power}`);
  });
  const body = terms.join("+").replace(/\+-/g, "-") || "0";
  return `${body}+O(t^${coefficients.length})`;
}

/// One sentence to print under the value: plain words, optionally with a formula (in the
/// notation's own syntax) between `before` and `after`, for the exporter to typeset.
export interface Note {
  readonly before: string;
  readonly math?: string;
  readonly after?: string;
}

/// The sentences to print under the value.
export function notesOf(v: ValueJsonLike): Note[] {
  const out: Note[] = [];
  if (v.type === "Series") {
    const n = strings(v.coefficients).length;
    // `checked`: the computed terms beyond those the guess was fitted to (issue 16)
    const checked = typeof v.checked === "number" ? v.checked : 0;
    const rational = str(v.rational);
    out.push(
      rational
        ? {
            before: "Guessed rational function ",
            math: rational,
            after: `: it reproduces ${checked} computed term${checked === 1 ? "" : "s"} beyond those it was fitted to; a guess, not a proof.`,
          }
        : { before: `No rational function was found that fits the ${n} computed terms.` },
    );
  }
  const note = str(v.note);
  if (note) out.push({ before: note.charAt(0).toUpperCase() + note.slice(1) + (/[.!?]$/.test(note) ? "" : ".") });
  return out;
}
