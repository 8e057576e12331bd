import type { SympySystem } from "./sympy";

/// mulberry32: a small seeded PRNG so the random systems are the same on every run
/// (common practice).
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const NAMES = ["x", "y", "z", "w"];

/// A random sparse system with small degrees, written in the canonical text syntax.
export function randomSystem(
  rng: () => number,
  o: { vars: number; gens: number; terms: number; degree: number; rational: boolean; modulus: number | null; order: SympySystem["order"] },
): SympySystem {
  const int = (lo: number, hi: number) => lo + Math.floor(rng() * (hi - lo + 1));
  const vars = NAMES.slice(0, o.vars);
  const gens: string[] = [];
  for (let g = 0; g < o.gens; g++) {
    const parts: string[] = [];
    const nt = int(2, o.terms);
    for (let t = 0; t < nt; t++) {
      const c = int(1, 9) * (rng() < 0.5 ? -1 : 1);
      const coef = o.rational && rng() < 0.3 ? `${c}/${int(2, 7)}` : String(c);
      const deg = int(t === 0 ? 1 : 0, o.degree);
      const exps = new Array<number>(o.vars).fill(0);
      for (let k = 0; k < deg; k++) exps[int(0, o.vars - 1)]++;
      const mono = vars
        .map((v, i) => (exps[i] === 0 ? "" : exps[i] === 1 ? v : `${v}^${exps[i]}`))
        .filter(Boolean)
        .join("*");
      parts.push(mono ? `(${coef})*${mono}` : `(${coef})`);
    }
    gens.push(parts.join("+"));
  }
  return { vars, gens, order: o.order, modulus: o.modulus };
}
