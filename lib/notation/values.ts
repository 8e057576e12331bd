/// Runtime values of the notation, one variant per type of notation.md §8.
/// Engine objects (rings, polynomials) are wrapped, never copied; numbers are exact.
import type { Field, HilbertSeries, Poly, PolyRing } from "../algebra/index";
import type { Rat } from "../algebra/index";

/// A ring of the notation: a polynomial ring S (its field, variables, degrees, order)
/// together with a defining ideal of S; the ideal is empty for S itself.
export interface RingValue {
  readonly type: "Ring";
  readonly poly: PolyRing;
  /// generators of the defining ideal, in S
  readonly ideal: readonly Poly[];
  /// reduced Gröbner basis of the defining ideal, computed once when first needed
  basis?: readonly Poly[];
  /// the quotient ring this one was formed from (A in A / I), when A is itself a quotient;
  /// absent for S and for quotients S / I of a polynomial ring. A quotient read as a module is
  /// a module over the ring it was formed from (notation.md §5).
  readonly over?: RingValue;
  /// set for a local ring (grammar/README.md, "Local rings": `localize`): the ring localised at the rational
  /// point `at` (all zeros for the origin); its properties are read there
  readonly local?: { readonly at: readonly Rat[] };
}

export interface PolyValue {
  readonly type: "Poly";
  readonly ring: RingValue;
  /// a representative in S, kept in normal form modulo the defining ideal
  readonly poly: Poly;
}

export interface IdealValue {
  readonly type: "Ideal";
  readonly ring: RingValue;
  /// generators as representatives in S (the defining ideal is implied)
  readonly gens: readonly Poly[];
  basis?: readonly Poly[];
}

export interface MatrixValue {
  readonly type: "Matrix";
  readonly ring: RingValue;
  readonly rows: readonly (readonly Poly[])[];
  /// number of columns, kept so that a matrix with no rows still has a shape
  readonly cols: number;
}

/// A finitely generated graded module over `ring`, always held by a presentation: the
/// cokernel of `presentation`, whose rows are the generators (in the degrees `degrees`, one
/// per row) and whose columns are the relations. image, ker, Tor and Ext are computed into
/// this form when they are made (lib/notation/modules.ts).
export interface ModuleValue {
  readonly type: "Module";
  readonly ring: RingValue;
  readonly presentation: MatrixValue;
  /// the degrees of the generators, one per row of the presentation
  readonly degrees: readonly number[];
}

export type BettiEntry = readonly [homological: number, internal: number, betti: number];

export interface BettiTableValue {
  readonly type: "BettiTable";
  /// nonzero β_{i,j}, sorted by i then j; j is the internal degree
  readonly entries: readonly BettiEntry[];
  readonly complete: boolean;
  /// when incomplete: which numbers a bound cut (shown in the text)
  readonly note?: string;
}

export interface ComplexValue {
  readonly type: "Complex";
  readonly ring: RingValue;
  readonly ranks: readonly number[];
  readonly betti: BettiTableValue;
  readonly complete: boolean;
  /// matrices of the differentials F_i → F_{i−1}, i = 1…length, when known
  readonly maps: readonly MatrixValue[] | null;
  /// when incomplete: which ranks a bound cut (shown in the text)
  readonly note?: string;
}

export interface HilbertSeriesValue {
  readonly type: "HilbertSeries";
  /// the series of the module moved up by `shift` into degrees ≥ 0 (the value itself is
  /// t^(−shift) times it: a Laurent numerator for modules generated in negative degrees)
  readonly series: HilbertSeries;
  /// generators in degree −shift (> 0): the numerator starts at t^(−shift); absent means 0
  readonly shift?: number;
  /// what the series is of, when that could mislead (a non-homogeneous ideal)
  readonly note?: string;
}

export interface SeriesValue {
  readonly type: "Series";
  readonly coefficients: readonly bigint[];
  /// a rational function fitting every computed term, as text; null when none was found
  readonly rational: string | null;
  /// the guessed numerator and denominator (ascending coefficients in t) and how many
  /// computed coefficients it reproduces beyond the 2L that determine it (the fit's own terms)
  readonly guess?: { readonly numerator: readonly bigint[]; readonly denominator: readonly bigint[]; readonly checked: number };
  /// how many leading coefficients are exact (the rest are lower bounds); all when absent
  readonly exact?: number;
}

export interface ListValue {
  readonly type: "List";
  readonly items: readonly Value[];
}

export interface RecordValue {
  readonly type: "Record";
  /// in the order written
  readonly fields: ReadonlyMap<string, Value>;
}

export interface FunctionValue {
  readonly type: "Function";
  readonly params: readonly string[];
  /// source text of the whole lambda, e.g. "(a, b) -> a + b"
  readonly source: string;
  /// applies the closure (depth: how deeply calls are nested); supplied by the evaluator
  readonly call: (args: readonly Value[], depth?: number) => Value;
  /// the values of the free names the body refers to, captured when the lambda was made
  readonly captures: ReadonlyMap<string, Value>;
  /// the ring that was current where the lambda was written (its literals are read there)
  readonly ring: RingValue | null;
}

/// A family of examples for experiments (notation.md §11): finite, ordered, its members
/// rings, ideals or modules. `generator` and `options` are the recipe (`random_ideals`,
/// `monomial_ideals`, `family`, `upload`, and `take`/`filter` of those); `definition` is its
/// text with the seeds, recorded with every experiment.
export interface FamilyValue {
  readonly type: "Family";
  /// the ring of the generated families; of the first member for a List (null when empty)
  readonly ring: RingValue | null;
  readonly generator: string;
  readonly options: ReadonlyMap<string, bigint>;
  readonly members: readonly FamilyMember[];
  /// e.g. "random_ideals(S, count = 20, gens = 3, degree = 2, seed = 7)"; derived from the
  /// recipe when absent
  readonly definition?: string;
}

export type FamilyMember = RingValue | IdealValue | ModuleValue;

export interface TableValue {
  readonly type: "Table";
  readonly columns: readonly string[];
  readonly rows: readonly (readonly Value[])[];
}

export type Value =
  /// `note`: how the number was found when that matters (a random choice); shown in the text
  | { readonly type: "Int"; readonly value: bigint; readonly note?: string }
  | { readonly type: "Rat"; readonly value: Rat }
  | { readonly type: "Bool"; readonly value: boolean }
  | { readonly type: "Str"; readonly value: string }
  | { readonly type: "Field"; readonly field: Field }
  | RingValue
  | PolyValue
  | IdealValue
  | MatrixValue
  | ModuleValue
  | ComplexValue
  | BettiTableValue
  | HilbertSeriesValue
  | SeriesValue
  | ListValue
  | RecordValue
  | FunctionValue
  | FamilyValue
  | TableValue
  | { readonly type: "None" };

export const list = (items: readonly Value[]): ListValue => ({ type: "List", items });
