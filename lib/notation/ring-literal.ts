/// Reads a ring literal `K[x1..x3, y; order = lex, degrees = (1, 2, 3, 1)]` straight
/// from the AST, for code the checker did not see in this evaluation (a restored lambda).
import type { Expr, Subscript } from "../../grammar/ast";
import type { RingLiteralInfo } from "../../grammar/analysis";
import { runtime } from "./errors";

function expandRange(from: string, to: string, e: Expr): string[] {
  const a = /^([A-Za-z_']*?)(\d+)$/.exec(from);
  const b = /^([A-Za-z_']*?)(\d+)$/.exec(to);
  if (a && b && a[1] === b[1]) {
    const out: string[] = [];
    for (let i = Number(a[2]); i <= Number(b[2]); i++) out.push(`${a[1]}${i}`);
    return out;
  }
  if (/^[a-zA-Z]$/.test(from) && /^[a-zA-Z]$/.test(to) && from <= to) {
    const out: string[] = [];
    for (let c = from.charCodeAt(0); c <= to.charCodeAt(0); c++) out.push(String.fromCharCode(c));
    return out;
  }
  throw runtime(`cannot expand the range of variables ${from}..${to}`, e.span);
}

function ints(e: Expr): number[] {
  const items = e.kind === "Tuple" || e.kind === "ListLit" ? e.items : [e];
  return items.map((x) => {
    if (x.kind !== "IntLit") throw runtime("expected an integer", x.span);
    return Number(x.value);
  });
}

export function ringLiteralFromAst(e: Subscript): RingLiteralInfo {
  const vars: string[] = [];
  for (const item of e.items) {
    if (item.kind === "Identifier") vars.push(item.name);
    else if (item.kind === "Range" && item.from.kind === "Identifier" && item.to.kind === "Identifier") {
      vars.push(...expandRange(item.from.name, item.to.name, item));
    } else throw runtime("a ring's variables are names or ranges of names", item.span);
  }
  let order: RingLiteralInfo["order"] = { kind: "grevlex" };
  let degrees: number[] | null = null;
  for (const opt of e.options) {
    const v = opt.value;
    if (opt.name.name === "order") {
      if (v.kind === "Identifier" && (v.name === "lex" || v.name === "glex" || v.name === "grevlex")) order = { kind: v.name };
      else if (v.kind === "Call" && v.callee.kind === "Identifier" && v.callee.name === "weights") {
        order = { kind: "weights", weights: v.args.flatMap(ints) };
      } else throw runtime("order is grevlex, lex, glex or weights(w1, …, wn)", v.span);
    } else if (opt.name.name === "degrees") degrees = ints(v);
    else throw runtime(`unknown ring option ${opt.name.name}`, opt.span);
  }
  return { kind: "ring", vars, order, degrees };
}
