/// Typesetting §9 values as LaTeX: polynomials, ideals and matrices in math mode, Betti
/// tables as `tabular` (rows j−i, columns i, as in Eisenbud, *The Geometry of Syzygies*,
/// Springer GTM 229, 2005, §1B), truncation kept as a note under the value.
import { notesOf, plainText, seriesPrefixText } from "./annotations";
import type { ValueJsonLike } from "./transcript";

const SPECIAL: Record<string, string> = {
  "\\": "\\textbackslash{}",
  "{": "\\{",
  "}": "\\}",
  $: "\\$",
  "&": "\\&",
  "#": "\\#",
  "^": "\\textasciicircum{}",
  _: "\\_",
  "%": "\\%",
  "~": "\\textasciitilde{}",
};

/// Text safe in LaTeX's text mode.
export function escapeTex(text: string): string {
  return text.replace(/[\\{}$&#^_%~]/g, (c) => SPECIAL[c]!);
}

/// A variable name in math mode: trailing digits become a subscript (x12 → x_{12}),
/// an underscore starts one (a_b → a_{b}), primes stay primes.
function mathName(name: string): string {
  const primes = /'+$/.exec(name)?.[0] ?? "";
  const base = name.slice(0, name.length - primes.length);
  const under = base.indexOf("_");
  let out: string;
  if (under > 0) out = `${base.slice(0, under)}_{${base.slice(under + 1).replace(/_/g, "\\_")}}`;
  else {
    const m = /^([A-Za-z]+)(\d+)$/.exec(base);
    out = m ? `${m[1]}_{${m[2]}}` : base;
  }
  if (out.length > 1 && !/[_{]/.test(out) && /^[A-Za-z]+$/.test(out)) out = `\\mathit{${out}}`;
  return out + primes;
}

/// A polynomial, number or series text (`3/4*x^2*y-2*x1+3`) as math-mode LaTeX.
export function mathText(text: string): string {
  let out = "";
  let i = 0;
  while (i < text.length) {
    const rest = text.slice(i);
    let m: RegExpExecArray | null;
    if ((m = /^(\d+)\/(\d+)/.exec(rest))) {
      out += `\\frac{${m[1]}}{${m[2]}}`;
    } else if ((m = /^\^(-?\d+|\([^)]*\))/.exec(rest))) {
      const e = m[1]!.startsWith("(") ? m[1]!.slice(1, -1) : m[1]!;
      out += `^{${e}}`;
    } else if ((m = /^[A-Za-z][A-Za-z0-9_]*'*/.exec(rest))) {
      out += mathName(m[0]);
    } else if ((m = /^\*/.exec(rest))) {
      out += " ";
    } else if ((m = /^[+-]/.exec(rest))) {
      out += i === 0 ? m[0] : ` ${m[0]} `;
    } else if ((m = /^\s+/.exec(rest))) {
      out += " ";
    } else if ((m = /^[{}$&#%~\\]/.exec(rest))) {
      out += `\\${m[0] === "\\" ? "backslash " : m[0]}`;
    } else {
      m = /^./.exec(rest)!;
      out += m[0];
    }
    i += m[0].length;
  }
  return out.replace(/ {2,}/g, " ").trim();
}

/// Q → \mathbb{Q}, GF(p) → \mathbb{F}_{p}; anything else as upright text.
export function fieldTex(text: string): string {
  if (text === "Q") return "\\mathbb{Q}";
  const m = /^GF\((\d+)\)$/.exec(text);
  return m ? `\\mathbb{F}_{${m[1]}}` : `\\mathrm{${escapeTex(text)}}`;
}

/// A ring value (§9 Ring: field, vars, ideal) in math mode: k[x, y] or k[x, y]/⟨f, g⟩.
export function ringTex(v: ValueJsonLike): string {
  const vars = field(v, "vars", isStrings);
  const fieldName = typeof v.field === "string" ? v.field : null;
  if (!vars || !fieldName) return `\\text{${escapeTex(v.text)}}`;
  const base = `${fieldTex(fieldName)}[${vars.map((x) => mathText(x)).join(", ")}]`;
  const ideal = field(v, "ideal", isStrings) ?? [];
  return ideal.length === 0 ? base : `${base}/\\langle ${ideal.map(mathText).join(",\\ ")} \\rangle`;
}

/// A record's fields in the order the user wrote them (§9 Record `fieldOrder`; jsonb storage
/// does not keep key order).
export function recordEntries(v: ValueJsonLike): [string, ValueJsonLike][] {
  const fields = (v.fields ?? {}) as Record<string, ValueJsonLike>;
  const keys = Object.keys(fields);
  const order = Array.isArray(v.fieldOrder) ? (v.fieldOrder as unknown[]) : null;
  const ordered =
    order && order.length === keys.length && order.every((k) => typeof k === "string" && Object.hasOwn(fields, k))
      ? (order as string[])
      : keys;
  return ordered.map((k) => [k, fields[k]!]);
}

function field<T>(v: ValueJsonLike, name: string, check: (x: unknown) => x is T): T | undefined {
  const x = v[name];
  return check(x) ? x : undefined;
}
const isStrings = (x: unknown): x is string[] => Array.isArray(x) && x.every((s) => typeof s === "string");
const isBool = (x: unknown): x is boolean => typeof x === "boolean";
const isEntries = (x: unknown): x is [number, number, number][] =>
  Array.isArray(x) && x.every((e) => Array.isArray(e) && e.length === 3 && e.every((n) => Number.isInteger(n)));
const isValues = (x: unknown): x is ValueJsonLike[] => Array.isArray(x) && x.every((e) => typeof e === "object" && e !== null);

/// The Betti table grid: rows r = j − i from the smallest to the largest, columns
/// i = 0 … max i; `null` where β_{i,i+r} is zero.
export function bettiGrid(entries: [number, number, number][]): {
  rows: number[];
  cols: number[];
  cell: (r: number, i: number) => number | null;
} {
  if (entries.length === 0) return { rows: [], cols: [], cell: () => null };
  const byKey = new Map(entries.map(([i, j, b]) => [`${i},${j - i}`, b]));
  const rs = entries.map(([i, j]) => j - i);
  const maxI = Math.max(...entries.map(([i]) => i));
  const rows: number[] = [];
  for (let r = Math.min(...rs); r <= Math.max(...rs); r++) rows.push(r);
  const cols = Array.from({ length: maxI + 1 }, (_, i) => i);
  return { rows, cols, cell: (r, i) => byKey.get(`${i},${r}`) ?? null };
}

export const TRUNCATED_BETTI =
  "Truncated: only the part of the resolution computed within the given bounds is shown; further Betti numbers may be nonzero.";

/// The totals row of a Betti table: β_i = Σ_j β_{i,j}, the rank of the i-th free module.
export function bettiTotals(entries: [number, number, number][], cols: readonly number[]): number[] {
  return cols.map((i) => entries.filter(([h]) => h === i).reduce((sum, [, , b]) => sum + b, 0));
}

export function bettiTabular(entries: [number, number, number][], complete: boolean): string {
  const { rows, cols, cell } = bettiGrid(entries);
  if (rows.length === 0) return "All Betti numbers are zero." + (complete ? "" : `\n\n\\emph{${TRUNCATED_BETTI}}`);
  const lines = [
    `\\begin{tabular}{r|${"r".repeat(cols.length)}}`,
    ` & ${cols.map((i) => `$${i}$`).join(" & ")} \\\\`,
    "\\hline",
    ...rows.map((r) => `$${r}$ & ${cols.map((i) => (cell(r, i) === null ? "" : `$${cell(r, i)}$`)).join(" & ")} \\\\`),
    "\\hline",
    `total & ${bettiTotals(entries, cols)
      .map((b) => `$${b}$`)
      .join(" & ")} \\\\`,
    "\\end{tabular}",
  ];
  if (!complete) lines.push("", `\\emph{${TRUNCATED_BETTI}}`);
  return lines.join("\n");
}

/// One value as LaTeX (a paragraph's worth; display material where it helps).
export function valueTex(v: ValueJsonLike): string {
  const notes = notesOf(v)
    .map(
      (n) => `\n\n\\emph{${escapeTex(n.before)}}${n.math ? `$${mathText(n.math)}$` : ""}${n.after ? `\\emph{${escapeTex(n.after)}}` : ""}`,
    )
    .join("");
  return valueBodyTex(v) + notes;
}

function valueBodyTex(v: ValueJsonLike): string {
  switch (v.type) {
    case "Int":
    case "Rat":
    case "Poly":
      return `$${mathText(plainText(v))}$`;
    case "Bool":
      return `$\\mathrm{${escapeTex(v.text)}}$`;
    case "Field":
      return `$${fieldTex(v.text)}$`;
    case "Ring":
      return `$${ringTex(v)}$`;
    case "Str":
      return `\\texttt{${escapeTex(typeof v.value === "string" ? v.value : v.text)}}`;
    case "Ideal": {
      const gens = field(v, "gens", isStrings) ?? [];
      return gens.length === 0 ? "$\\langle 0 \\rangle$" : `$\\langle ${gens.map(mathText).join(",\\ ")} \\rangle$`;
    }
    case "Matrix": {
      const rows = (v.rows as unknown[] | undefined)?.filter(isStrings) ?? [];
      if (rows.length === 0) return `\\texttt{${escapeTex(v.text)}}`;
      return `\\[\\begin{pmatrix}\n${rows.map((r) => r.map(mathText).join(" & ")).join(" \\\\\n")}\n\\end{pmatrix}\\]`;
    }
    case "BettiTable":
      return bettiTabular(field(v, "entries", isEntries) ?? [], field(v, "complete", isBool) ?? true);
    case "Complex": {
      const ranks = (v.ranks as number[] | undefined) ?? [];
      return (
        `Free ranks $${ranks.join(",\\ ")}$.\n\n` + bettiTabular(field(v, "betti", isEntries) ?? [], field(v, "complete", isBool) ?? true)
      );
    }
    case "HilbertSeries":
      return `$${mathText(plainText(v))}$`;
    case "Series":
      return `$${mathText(seriesPrefixText(field(v, "coefficients", isStrings) ?? []))}$`;
    case "List": {
      const items = field(v, "items", isValues) ?? [];
      if (items.length === 0) return "(empty list)";
      return `\\begin{enumerate}\n${items.map((x) => `\\item ${valueTex(x)}`).join("\n")}\n\\end{enumerate}`;
    }
    case "Record": {
      return `\\begin{description}\n${recordEntries(v)
        .map(([k, x]) => `\\item[${escapeTex(k)}] ${valueTex(x)}`)
        .join("\n")}\n\\end{description}`;
    }
    case "Table": {
      const columns = field(v, "columns", isStrings) ?? [];
      const rows = (Array.isArray(v.rows) ? v.rows : []).filter(isValues);
      return [
        `\\begin{tabular}{${"l".repeat(Math.max(1, columns.length))}}`,
        `${columns.map((c) => `\\textbf{${escapeTex(c)}}`).join(" & ")} \\\\`,
        "\\hline",
        ...rows.map(
          (r) =>
            `${r.map((x) => (x.type === "Str" || x.type === "Int" || x.type === "Rat" || x.type === "Poly" || x.type === "Bool" ? valueTex(x) : `\\texttt{${escapeTex(x.text)}}`)).join(" & ")} \\\\`,
        ),
        "\\end{tabular}",
      ].join("\n");
    }
    case "None":
      return "\\emph{(no value)}";
    default:
      return `\\texttt{${escapeTex(v.text)}}`;
  }
}
