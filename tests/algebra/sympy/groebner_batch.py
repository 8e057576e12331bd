"""Reads a JSON list of systems on stdin, prints SymPy's reduced Groebner bases as JSON.

Each system: {"vars": [...], "gens": ["x^2-y", ...], "order": "grevlex"|"lex"|"grlex",
"modulus": p or null}; order "lazard" is the product order lex on the first variable, then
grevlex on the rest (on forms of one degree: Lazard's order for a local degree order). Each basis element is written as a list of terms
[[numerator, denominator, [exponents...]], ...], normalised to be monic; over GF(p) the
coefficients are residues in [0, p).
"""
import json
import sys
import time

from sympy import Poly, QQ, Rational, groebner, symbols
from sympy.polys.orderings import ProductOrder, grevlex, lex
from sympy.parsing.sympy_parser import parse_expr


def basis_terms(system):
    names = system["vars"]
    gens = symbols(names)
    if len(names) == 1:
        gens = (gens,) if not isinstance(gens, (list, tuple)) else gens
    local = {n: g for n, g in zip(names, gens)}
    exprs = [parse_expr(t.replace("^", "**"), local_dict=local) for t in system["gens"]]
    p = system.get("modulus")
    order = system["order"]
    if order == "lazard":
        order = ProductOrder((lex, lambda m: m[:1]), (grevlex, lambda m: m[1:]))
    opts = {"order": order}
    if p:
        opts["modulus"] = p
    else:
        opts["domain"] = QQ
    start = time.perf_counter()
    G = groebner(exprs, *gens, **opts)
    seconds = time.perf_counter() - start
    out = []
    for g in G.exprs:
        P = Poly(g, *gens, modulus=p) if p else Poly(g, *gens, domain=QQ)
        terms = P.terms(order=order)
        lc = Rational(int(terms[0][1]) if p else terms[0][1])
        row = []
        for monom, coeff in terms:
            if p:
                c = (int(coeff) * pow(int(lc) % p, -1, p)) % p
                row.append([str(c), "1", list(monom)])
            else:
                c = Rational(coeff) / lc
                row.append([str(c.p), str(c.q), list(monom)])
        out.append(row)
    return {"basis": out, "seconds": seconds}


def main():
    systems = json.load(sys.stdin)
    results = []
    for s in systems:
        try:
            results.append(basis_terms(s))
        except Exception as e:  # reported per system so one failure does not hide the rest
            results.append({"error": f"{type(e).__name__}: {e}"})
    json.dump(results, sys.stdout)


if __name__ == "__main__":
    main()
