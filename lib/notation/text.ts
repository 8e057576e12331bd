/// The human "text" of every value (notation.md §9): notation-like, one line except tables.
import { formatPoly, type Field, type OrderSpec } from "../algebra/index";
import { ascendingText, hilbertText } from "./series-text";
import { ratToString } from "../algebra/index";
import type { BettiTableValue, ExperimentValue, FamilyValue, MatrixValue, ModuleValue, RingValue, Value } from "./values";

export function fieldText(f: Field): string {
  return f.kind === "Q" ? "Q" : `GF(${f.p})`;
}

/// JSON form of an order: "grevlex", "lex", "glex", "weights(1,2,3)".
export function orderText(o: OrderSpec): string {
  return o.kind === "weights" ? `weights(${o.weights.join(",")})` : o.kind;
}

export function polyRingText(r: RingValue): string {
  const { field, vars, degrees, order } = r.poly;
  const opts: string[] = [];
  if (order.kind !== "grevlex") opts.push(`order = ${order.kind === "weights" ? `weights(${order.weights.join(", ")})` : order.kind}`);
  if (degrees.some((d) => d !== 1)) opts.push(`degrees = (${degrees.join(", ")})`);
  return `${fieldText(field)}[${vars.join(", ")}${opts.length > 0 ? `; ${opts.join(", ")}` : ""}]`;
}

export function ringText(r: RingValue): string {
  const base = polyRingText(r);
  const global = r.ideal.length === 0 ? base : `${base} / <${r.ideal.map((f) => formatPoly(r.poly, f)).join(", ")}>`;
  if (!r.local) return global;
  const origin = r.local.at.every((a) => a.n === 0n);
  return `localize(${global}${origin ? "" : `, at = [${r.local.at.map(ratToString).join(", ")}]`})`;
}

export function matrixText(m: MatrixValue): string {
  if (m.rows.length === 0) return `matrix(0 × ${m.cols})`;
  return `[${m.rows.map((row) => row.map((f) => formatPoly(m.ring.poly, f)).join(", ")).join("; ")}]`;
}

/// A free module as `R^n` or `R^[d1, …]`; otherwise `coker([…]) over R`, with the generators'
/// degrees when they are not all 0.
export function moduleText(m: ModuleValue): string {
  const ring = ringText(m.ring);
  const r = m.degrees.length;
  const zeroDegrees = m.degrees.every((d) => d === 0);
  const base = m.ring.ideal.length > 0 ? `(${ring})` : ring;
  if (r === 0) return `the zero module over ${ring}`;
  if (m.presentation.cols === 0) return zeroDegrees ? `${base}^${r}` : `${base}^[${m.degrees.join(", ")}]`;
  const degs = zeroDegrees ? "" : `, generators in degrees [${m.degrees.join(", ")}]`;
  return `coker(${matrixText(m.presentation)}) over ${ring}${degs}`;
}

export function bettiText(b: BettiTableValue): string {
  const entries = b.entries.map(([i, j, n]) => `β(${i},${j})=${n}`).join(", ");
  return `Betti numbers ${entries === "" ? "all zero" : entries}${b.complete ? "" : b.note ? ` (truncated: ${b.note})` : " (truncated)"}`;
}

/// A truncated series, saying which coefficients are lower bounds and how the rational
/// function (if any) was found.
function seriesText(v: Extract<Value, { type: "Series" }>): string {
  const n = v.coefficients.length;
  let out = `${ascendingText(v.coefficients)}+O(t^${n})`;
  if (v.exact !== undefined && v.exact < n)
    out += ` (the coefficients of t^${v.exact} and beyond are lower bounds: a degree bound cut the resolution)`;
  if (v.rational !== null) {
    const k = v.guess?.checked;
    out += `; guessed rational function ${v.rational}${k !== undefined ? ` (a guess: it reproduces ${k} computed term${k === 1 ? "" : "s"} beyond those it was fitted to)` : " (a guess)"}`;
  }
  return out;
}

export function valueText(v: Value): string {
  switch (v.type) {
    case "Int":
      return v.note ? `${v.value} (${v.note})` : String(v.value);
    case "Bool":
      return String(v.value);
    case "Rat":
      return ratToString(v.value);
    case "Str":
      return v.value;
    case "Field":
      return fieldText(v.field);
    case "Ring":
      return ringText(v);
    case "Poly":
      return formatPoly(v.ring.poly, v.poly);
    case "Ideal":
      return v.gens.length === 0 ? "<0>" : `<${v.gens.map((f) => formatPoly(v.ring.poly, f)).join(", ")}>`;
    case "Matrix":
      return matrixText(v);
    case "Module":
      return moduleText(v);
    case "Complex":
      return `complex of ranks ${v.ranks.join(", ")}${v.complete ? "" : v.note ? ` (truncated: ${v.note})` : " (truncated)"}`;
    case "BettiTable":
      return bettiText(v);
    case "HilbertSeries":
      return hilbertText(v.series, v.shift ?? 0) + (v.note ? ` (${v.note})` : "");
    case "Series":
      return seriesText(v);
    case "List":
      return `[${v.items.map(valueText).join(", ")}]`;
    case "Record":
      return `{${[...v.fields].map(([k, x]) => `${k}: ${valueText(x)}`).join(", ")}}`;
    case "Function":
      return v.source;
    case "Family": {
      const kinds = [...new Set(v.members.map((m) => m.type))];
      const noun = kinds.length === 1 ? `${kinds[0].toLowerCase()}${v.members.length === 1 ? "" : "s"}` : "members";
      return `${familyDefinition(v)}: ${v.members.length} ${noun}`;
    }
    case "Table":
      // seconds are exact Rats of whole milliseconds; a table shows them as decimals
      return [
        v.columns.join(" | "),
        ...v.rows.map((row) =>
          row.map((x, i) => (v.columns[i] === "seconds" && x.type === "Rat" ? decimalText(x.value) : valueText(x))).join(" | "),
        ),
      ].join("\n");
    case "Experiment":
      return experimentText(v);
    case "None":
      return "none";
  }
}

/// How a family was made, with its seeds: the recorded definition, or its recipe.
export function familyDefinition(v: FamilyValue): string {
  return v.definition ?? `${v.generator}(${[...v.options].map(([k, x]) => `${k} = ${x}`).join(", ")})`;
}

/// A Rat with a power-of-ten-friendly denominator (milliseconds) as a decimal, 3 places.
function decimalText(r: { n: bigint; d: bigint }): string {
  const thousandths = (r.n * 1000n) / r.d;
  const sign = thousandths < 0n ? "-" : "";
  const a = thousandths < 0n ? -thousandths : thousandths;
  return `${sign}${a / 1000n}.${(a % 1000n).toString().padStart(3, "0")}`;
}

/// An experiment handle: its counts, and that it runs in the background and how to follow it.
export function experimentText(v: ExperimentValue): string {
  const failed = v.failures === 0 ? "" : `, ${v.failures} failed`;
  const running = v.status === "queued" || v.status === "running";
  return (
    `experiment ${v.id}: ${v.status}, ${v.done}/${v.total} members done${failed}` +
    (running ? " — runs in the background; follow it in the experiments list or at GET /api/experiments/" + v.id : "")
  );
}
