/// What the checker can know about gradings before anything runs: `resolve(S / I)` over a
/// polynomial ring S needs a homogeneous ideal I (a minimal graded resolution), and when S
/// is a ring literal and I an ideal literal of this program, homogeneity is decided here by
/// expanding the generators exactly (integer coefficients, reduced mod p over GF(p)), so the
/// user hears it at once, with the generator and the degrees that clash, instead of after
/// submitting the cell. Anything it cannot read exactly (names from earlier cells,
/// divisions, large powers) it leaves to the evaluator.
import type { Call, Expr, Identifier, IdealLit, Program, Subscript } from "./ast";
import type { Diagnostic, NameResolution, SubscriptInfo } from "./analysis";

interface RingFacts {
  readonly degrees: readonly number[];
  /// 0 for Q, p for GF(p)
  readonly characteristic: bigint;
}

/// A polynomial as monomial key (exponents joined by ",") → integer coefficient.
type Expansion = Map<string, bigint>;

const MAX_TERMS = 2000;
const MAX_POWER = 40n;

function characteristicOf(base: Expr): bigint | null {
  if (base.kind === "Identifier" && base.name === "Q") return 0n;
  if (base.kind === "Call" && base.callee.kind === "Identifier" && base.callee.name === "GF" && base.args[0]?.kind === "IntLit")
    return base.args[0].value;
  return null;
}

function ringFacts(node: Subscript, info: SubscriptInfo | undefined): RingFacts | null {
  if (info?.kind !== "ring") return null;
  const characteristic = characteristicOf(node.object);
  if (characteristic === null) return null;
  return { degrees: info.degrees ?? info.vars.map(() => 1), characteristic };
}

function reduce(c: bigint, p: bigint): bigint {
  return p === 0n ? c : ((c % p) + p) % p;
}

function add(a: Expansion, b: Expansion, sign: bigint, p: bigint): Expansion {
  const out = new Map(a);
  for (const [k, c] of b) {
    const v = reduce((out.get(k) ?? 0n) + sign * c, p);
    if (v === 0n) out.delete(k);
    else out.set(k, v);
  }
  return out;
}

function mul(a: Expansion, b: Expansion, n: number, p: bigint): Expansion | null {
  if (a.size * b.size > MAX_TERMS) return null;
  let out: Expansion = new Map();
  for (const [ka, ca] of a) {
    const ea = ka.split(",").map(Number);
    for (const [kb, cb] of b) {
      const eb = kb.split(",").map(Number);
      const key = Array.from({ length: n }, (_, i) => ea[i]! + eb[i]!).join(",");
      out = add(out, new Map([[key, ca * cb]]), 1n, p);
    }
  }
  return out;
}

/// The exact expansion of `e` in the ring whose variables `names` resolves (null: unknown).
function expand(e: Expr, ring: string, n: number, names: ReadonlyMap<Identifier, NameResolution>, p: bigint): Expansion | null {
  const constant = (c: bigint): Expansion => {
    const v = reduce(c, p);
    return v === 0n ? new Map() : new Map([[Array(n).fill(0).join(","), v]]);
  };
  switch (e.kind) {
    case "IntLit":
      return constant(e.value);
    case "Identifier": {
      const r = names.get(e);
      if (r?.kind !== "variable" || r.ring !== ring || r.index >= n) return null;
      return new Map([[Array.from({ length: n }, (_, i) => (i === r.index ? 1 : 0)).join(","), 1n]]);
    }
    case "Unary": {
      if (e.op !== "-") return null;
      const x = expand(e.operand, ring, n, names, p);
      return x && add(new Map(), x, -1n, p);
    }
    case "Binary": {
      if (e.op === "^") {
        if (e.right.kind !== "IntLit" || e.right.value < 0n || e.right.value > MAX_POWER) return null;
        const base = expand(e.left, ring, n, names, p);
        if (!base) return null;
        let out: Expansion | null = constant(1n);
        for (let k = 0n; k < e.right.value && out; k++) out = mul(out, base, n, p);
        return out;
      }
      if (e.op !== "+" && e.op !== "-" && e.op !== "*") return null;
      const l = expand(e.left, ring, n, names, p);
      const r = l && expand(e.right, ring, n, names, p);
      if (!l || !r) return null;
      return e.op === "*" ? mul(l, r, n, p) : add(l, r, e.op === "+" ? 1n : -1n, p);
    }
    default:
      return null;
  }
}

/// The distinct degrees of the terms of a generator, or null when it cannot be read exactly.
function termDegrees(e: Expr, ring: string, facts: RingFacts, names: ReadonlyMap<Identifier, NameResolution>): number[] | null {
  const x = expand(e, ring, facts.degrees.length, names, facts.characteristic);
  if (!x) return null;
  const degrees = new Set<number>();
  for (const key of x.keys()) degrees.add(key.split(",").reduce((s, v, i) => s + Number(v) * facts.degrees[i]!, 0));
  return [...degrees].sort((a, b) => a - b);
}

interface IdealFacts {
  readonly ring: string;
  /// the first generator whose terms have different degrees, with those degrees
  readonly mixed: { readonly generator: Expr; readonly degrees: readonly number[] } | null;
}

function idealFacts(
  lit: IdealLit,
  names: ReadonlyMap<Identifier, NameResolution>,
  rings: ReadonlyMap<string, RingFacts>,
): IdealFacts | null {
  let ring: string | null = null;
  const walk = (e: Expr): void => {
    if (e.kind === "Identifier") {
      const r = names.get(e);
      if (r?.kind === "variable") ring ??= r.ring;
    } else if (e.kind === "Binary") {
      walk(e.left);
      walk(e.right);
    } else if (e.kind === "Unary") walk(e.operand);
  };
  lit.gens.forEach(walk);
  if (ring === null) return null;
  const facts = rings.get(ring);
  if (!facts) return null;
  for (const g of lit.gens) {
    const degrees = termDegrees(g, ring, facts, names);
    if (degrees === null) return null;
    if (degrees.length > 1) return { ring, mixed: { generator: g, degrees } };
  }
  return { ring, mixed: null };
}

function visitCalls(e: Expr, f: (c: Call) => void): void {
  switch (e.kind) {
    case "Call":
      f(e);
      e.args.forEach((a) => visitCalls(a, f));
      e.named.forEach((a) => visitCalls(a.value, f));
      return;
    case "Binary":
      visitCalls(e.left, f);
      visitCalls(e.right, f);
      return;
    case "Unary":
      visitCalls(e.operand, f);
      return;
    case "Property":
      visitCalls(e.object, f);
      return;
    case "ListLit":
    case "Tuple":
      e.items.forEach((i) => visitCalls(i, f));
      return;
    default:
      return;
  }
}

export function gradedProblems(
  program: Program,
  source: string,
  names: ReadonlyMap<Identifier, NameResolution>,
  subscripts: ReadonlyMap<Subscript, SubscriptInfo>,
): Diagnostic[] {
  const rings = new Map<string, RingFacts>();
  const ideals = new Map<string, IdealFacts | null>();
  const problems: Diagnostic[] = [];
  const text = (e: Expr) => source.slice(e.span.from.offset, e.span.to.offset);
  for (const s of program.statements) {
    const exprs = s.kind === "Define" ? [s.value] : s.kind === "ExprStatement" ? [s.expr] : [];
    for (const e of exprs) {
      visitCalls(e, (call) => {
        if (call.callee.kind !== "Identifier" || call.callee.name !== "resolve") return;
        const arg = call.args[0];
        if (arg?.kind !== "Binary" || arg.op !== "/" || arg.left.kind !== "Identifier") return;
        const ringName = arg.left.name;
        if (!rings.has(ringName)) return;
        const facts =
          arg.right.kind === "IdealLit"
            ? idealFacts(arg.right, names, rings)
            : arg.right.kind === "Identifier"
              ? (ideals.get(arg.right.name) ?? null)
              : null;
        if (!facts || facts.ring !== ringName || !facts.mixed) return;
        const { generator, degrees } = facts.mixed;
        problems.push({
          kind: "type",
          message:
            `resolve needs a homogeneous ideal here (a graded resolution over ${ringName}), but the generator ${text(generator)} ` +
            `has terms of degrees ${degrees.join(" and ")}: make every generator's terms share one degree (homogenize it with a new variable), ` +
            `or ask a question that needs no grading (such as .is_homogeneous, .dim or .codim)`,
          span: arg.right.span,
        });
      });
    }
    if (s.kind === "Define") {
      rings.delete(s.name.name);
      ideals.delete(s.name.name);
      if (s.value.kind === "Subscript") {
        const facts = ringFacts(s.value, subscripts.get(s.value));
        if (facts) rings.set(s.name.name, facts);
      } else if (s.value.kind === "IdealLit") {
        ideals.set(s.name.name, idealFacts(s.value, names, rings));
      }
    }
  }
  return problems;
}
