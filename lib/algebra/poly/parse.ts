import { runtimeError } from "../errors";
import { MAX_EXPONENT, monoFromExps } from "../monomial/monomial";
import type { ComputeOptions } from "../options";
import { addScaled, constPoly, mulPoly, negPoly, powPoly } from "./arith";
import { asTyped, makePoly, type Poly } from "./poly";
import type { RingCtx } from "./ring";

type Tok =
  | { t: "num"; v: bigint; at: number; end: number }
  | { t: "id"; v: string; at: number; end: number }
  | { t: "op"; v: string; at: number; end: number }
  | { t: "end"; at: number; end: number };

const where = "parsePoly";

function fail(text: string, at: number, why: string): never {
  throw runtimeError(where, `column ${at + 1} of ${JSON.stringify(text)}: ${why}`, at);
}

function tokenize(text: string): Tok[] {
  const out: Tok[] = [];
  let i = 0;
  while (i < text.length) {
    const ch = text[i];
    if (/\s/.test(ch)) {
      i++;
      continue;
    }
    if (/[0-9]/.test(ch)) {
      let j = i;
      while (j < text.length && /[0-9]/.test(text[j])) j++;
      if (text[j] === ".") fail(text, j, "decimal numbers are not exact; write a fraction such as 3/2");
      if (j < text.length && /[A-Za-z_(]/.test(text[j])) {
        fail(text, j, `missing '*': write ${text.slice(i, j)}*${text[j] === "(" ? "(" : text[j]} instead of ${text.slice(i, j)}${text[j]}`);
      }
      out.push({ t: "num", v: BigInt(text.slice(i, j)), at: i, end: j });
      i = j;
      continue;
    }
    if (/[A-Za-z_]/.test(ch)) {
      let j = i;
      while (j < text.length && /[A-Za-z0-9_]/.test(text[j])) j++;
      out.push({ t: "id", v: text.slice(i, j), at: i, end: j });
      i = j;
      continue;
    }
    if ("+-*/^()".includes(ch)) {
      out.push({ t: "op", v: ch, at: i, end: i + 1 });
      i++;
      continue;
    }
    fail(text, i, `unexpected character ${JSON.stringify(ch)}`);
  }
  out.push({ t: "end", at: text.length, end: text.length });
  return out;
}

/// Reads a polynomial: the canonical text of formatPoly and generally + - * / ^ ( ) with
/// integer and rational coefficients; division only by non-zero constants.
export function parsePoly<C>(R: RingCtx<C>, text: string, opts?: ComputeOptions): Poly {
  if (typeof text !== "string") throw runtimeError(where, "the input must be a string");
  const toks = tokenize(text);
  let k = 0;
  const K = R.K;
  const varIndex = new Map(R.ring.vars.map((v, i) => [v, i]));
  const peek = () => toks[k];
  const isOp = (v: string) => {
    const t = toks[k];
    return t.t === "op" && t.v === v;
  };
  const startsFactor = (t: Tok) => t.t === "num" || t.t === "id" || (t.t === "op" && t.v === "(");

  function expr(): Poly {
    let acc = term();
    while (isOp("+") || isOp("-")) {
      const minus = peek().t === "op" && (peek() as { v: string }).v === "-";
      k++;
      const rhs = term();
      acc = addScaled(R, acc, rhs, minus ? K.neg(K.one) : K.one);
    }
    return acc;
  }

  function term(): Poly {
    let acc = unary();
    for (;;) {
      if (isOp("*")) {
        k++;
        acc = mulPoly(R, acc, unary(), opts);
      } else if (isOp("/")) {
        const at = peek().at;
        k++;
        const d = asTyped<C>(unary());
        if (d.m.length === 0) fail(text, at, "division by zero");
        if (d.m.length > 1 || d.m[0].some((x, i) => i >= 3 && x !== 0)) {
          fail(text, at, "division is only by a non-zero number");
        }
        acc = mulPoly(R, acc, constPoly(R, K.inv(d.c[0])), opts);
      } else if (startsFactor(peek())) {
        fail(text, peek().at, "missing operator (write * for a product)");
      } else return acc;
    }
  }

  function unary(): Poly {
    if (isOp("-")) {
      k++;
      return negPoly(R, unary());
    }
    if (isOp("+")) {
      k++;
      return unary();
    }
    return power();
  }

  function power(): Poly {
    const base = atom();
    if (!isOp("^")) return base;
    k++;
    const t = peek();
    if (t.t === "op" && t.v === "-") fail(text, t.at, "exponents must be non-negative integers");
    if (t.t !== "num") fail(text, t.at, "expected a non-negative integer exponent after '^'");
    k++;
    if (t.v >= BigInt(MAX_EXPONENT)) fail(text, t.at, `the exponent ${t.v} is too large (at most ${MAX_EXPONENT - 1})`);
    if (isOp("^")) fail(text, peek().at, "write parentheses for a tower of powers, (a^b)^c");
    return powPoly(R, base, Number(t.v), opts);
  }

  function atom(): Poly {
    const t = peek();
    if (t.t === "num") {
      k++;
      return constPoly(R, K.fromRational(t.v, 1n));
    }
    if (t.t === "id") {
      k++;
      const i = varIndex.get(t.v);
      if (i === undefined) {
        const known = R.ring.vars.length ? `the ring's variables are ${R.ring.vars.join(", ")}` : "the ring has no variables";
        fail(text, t.at, `unknown variable ${t.v}; ${known}`);
      }
      const exps = new Array<number>(R.n).fill(0);
      exps[i] = 1;
      return makePoly([monoFromExps(R.layout, exps)], [K.one]);
    }
    if (t.t === "op" && t.v === "(") {
      k++;
      const inner = expr();
      if (!isOp(")")) fail(text, peek().at, "expected ')'");
      k++;
      return inner;
    }
    if (t.t === "end") fail(text, t.at, t.at === 0 ? "empty input" : "the input ends too early");
    fail(text, t.at, `unexpected ${JSON.stringify((t as { v: string }).v)}`);
  }

  const result = expr();
  const rest = peek();
  if (rest.t !== "end") fail(text, rest.at, rest.t === "op" && rest.v === ")" ? "unbalanced ')'" : "unexpected text");
  return result;
}
