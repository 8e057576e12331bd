import { runtimeError } from "../errors";
import { type Mono, monoDiv, monoDivides } from "../monomial/monomial";
import { addScaled, mulTerm } from "../poly/arith";
import { asTyped, makePoly, type Poly } from "../poly/poly";
import { type PolyRing, ringCtx } from "../poly/ring";
import { checkpoint, type ComputeOptions } from "../options";

/// h / f when f divides h exactly (an error otherwise): the quotient of the division
/// algorithm by one polynomial, whose remainder must vanish.
export function exactQuotient(R: PolyRing, h: Poly, f: Poly, opts?: ComputeOptions): Poly {
  const ctx = ringCtx(R);
  const K = ctx.K;
  if (f.m.length === 0) throw runtimeError("exactQuotient", "division by the zero polynomial");
  const lm = f.m[0];
  const lcInv = K.inv(asTyped(f).c[0]);
  const qm: Mono[] = [];
  const qc: unknown[] = [];
  let rest = h;
  while (rest.m.length > 0) {
    checkpoint(opts, { stage: "exact division", detail: `${rest.m.length} terms left` });
    const m = rest.m[0];
    if (!monoDivides(lm, m)) throw runtimeError("exactQuotient", "the divisor does not divide the polynomial");
    const t = monoDiv(m, lm);
    const s = K.mul(asTyped(rest).c[0], lcInv);
    qm.push(t);
    qc.push(s);
    rest = addScaled(ctx, rest, mulTerm(ctx, f, s, t), K.neg(K.one));
  }
  return makePoly(qm, qc);
}
