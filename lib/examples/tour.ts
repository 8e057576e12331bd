/// The guided first-steps tour: runnable examples in an invented research scenario.
/// The Saltmarsh Syzygy Circle (a fictional group) studies "tideline ideals": the
/// ideal of products of neighbouring variables along a line of variables, and what
/// happens when the line closes into a loop or is cut by squares. Each example is
/// self-contained (it defines the ring it uses), so it runs in any session.

/// One step of the tour.
export interface GuidedExample {
  readonly id: string;
  readonly title: string;
  /// The program, in the notation (notation.md).
  readonly source: string;
  /// What it computes.
  readonly computes: string;
  /// Why a researcher of the Circle would compute it.
  readonly why: string;
  /// What to look at in the answer.
  readonly lookAt: string;
}

const RING = "S := GF(32003)[a..f]";
const TIDELINE = "tide := <a*b, b*c, c*d, d*e, e*f>";

/// The tour, in order.
export const GUIDED_TOUR: readonly GuidedExample[] = [
  {
    id: "workbench",
    title: "1. Set up the workbench ring",
    source: RING,
    computes: "the polynomial ring in the six variables a, …, f over the prime field with 32003 elements",
    why: "the Circle works over a large prime field: the answers for its questions match those over Q, and arithmetic stays small",
    lookAt: "the ring appears on the shelf as S and becomes the current ring, so later literals are read in it",
  },
  {
    id: "tideline",
    title: "2. The first tideline ideal",
    source: `${RING}\n${TIDELINE}\ntide.groebner`,
    computes: "the tideline ideal of length six and its reduced Gröbner basis",
    why: "every later computation starts from a Gröbner basis; for an ideal of monomials it is the minimal generators themselves",
    lookAt: "the five generators come back unchanged: a monomial ideal is its own Gröbner basis",
  },
  {
    id: "betti",
    title: "3. Its Betti table",
    source: `${RING}\n${TIDELINE}\nresolve(S / tide).betti`,
    computes: "the minimal graded free resolution of S / tide and its Betti numbers",
    why: "the Circle compares tidelines of different lengths by the shape of their Betti tables",
    lookAt: "the columns are homological degrees; each row is the internal degree minus the column; blank cells are zero",
  },
  {
    id: "hilbert",
    title: "4. Counting monomials: the Hilbert series",
    source: `${RING}\n${TIDELINE}\nhilbert(S / tide)`,
    computes: "the Hilbert series of S / tide as a rational function in t",
    why: "the denominator's exponent after cancelling gives the dimension, the numerator's value at 1 the degree",
    lookAt: "the numerator is the alternating sum of the Betti table's rows; compare it with step 3",
  },
  {
    id: "invariants",
    title: "5. Is the tideline Cohen–Macaulay?",
    source: `${RING}\n${TIDELINE}\n{dim: (S / tide).dim, depth: (S / tide).depth, pd: (S / tide).pd}`,
    computes: "the dimension, depth and projective dimension of S / tide in one record",
    why: "a quotient is Cohen–Macaulay exactly when its depth equals its dimension; the Circle tabulates which tidelines are",
    lookAt: "by the Auslander–Buchsbaum formula pd + depth = 6, the number of variables",
  },
  {
    id: "loop",
    title: "6. Closing the line into a loop",
    source: `${RING}\n${TIDELINE}\nloop := tide + <f*a>\nresolve(S / loop).ranks`,
    computes: "the ideal of the closed loop of six variables and the ranks of its minimal resolution",
    why: "closing the line adds one generator but can change the whole resolution; the Circle wants to know how much",
    lookAt: "compare the ranks with the totals row of the Betti table in step 3",
  },
  {
    id: "ribbon",
    title: "7. A ribbon of minors",
    source: "P := GF(32003)[a..d]\nribbon := minors([a, b, c; b, c, d], 2)\nresolve(P / ribbon).betti",
    computes: "the ideal of 2×2 minors of a 2×3 matrix of variables, and its Betti table",
    why: "the Circle's loops degenerate to such determinantal ideals, whose resolutions are known in closed form",
    lookAt: "three quadrics and two linear relations among them: Betti numbers 1, 3, 2 (Eagon and Northcott, 1962)",
  },
  {
    id: "residue",
    title: "8. An infinite resolution, truncated",
    source: "A := GF(101)[u, v]\nR := A / <u^2, v^2>\npoincare(R.residue, terms = 6)",
    computes: "the first six Betti numbers of the residue field over a quotient ring, as a series",
    why: "over a quotient ring resolutions rarely end; the Circle reads their growth from the Poincaré series",
    lookAt: "the coefficients grow by one each step, and the guessed rational function fits every computed term",
  },
];

/// The tour's last step, after the examples above: a small sweep run as a background
/// experiment, whose room opens on its plot. It is set in the project's demo scenario, the
/// invented Kestrel Lake syzygy group (db/seed.ts), who compare how graded Betti numbers
/// change across a family. Kept apart from GUIDED_TOUR because it needs the server's
/// experiment jobs (POST /api/experiments), not only the input.
export const EXPERIMENT_STEP: GuidedExample = {
  id: "kestrel-sweep",
  title: "9. A small sweep: every quadratic monomial ideal, side by side",
  source:
    "S := GF(32003)[a..d]\nsweep(monomial_ideals(S, degree = 2, max_gens = 3, up_to_symmetry = true), I -> {codim: I.codim, degree: I.degree, pd: (S / I).pd, reg: (S / I).reg, betti: resolve(S / I).betti})",
  computes:
    "for each ideal generated by one to three quadratic monomials in four variables (one per orbit of permuting the variables, 18 in all), its codimension, degree, projective dimension, regularity and Betti table",
  why: "the Kestrel Lake syzygy group looks for patterns across whole families rather than one ideal at a time; a sweep runs one member per job and keeps every row",
  lookAt:
    "the heat map of graded Betti numbers β(i,j) across members: two quadrics with no common variable (members 3, 4, 6) have one quadratic syzygy β(2,4) = 1, the Koszul relation of a complete intersection, while two sharing a variable have a linear one, β(2,3)",
};
