import { limitError } from "../../errors";
import { announce, checkLimit, checkpoint, Ticker, type ComputeOptions, type ProgressInfo } from "../../options";
import type { RingCtx } from "../../poly/ring";
import { divisorsOf } from "../../module/divide";
import { schreyerOrder, type ModuleOrder } from "../../module/order";
import { schreyerFrame, schreyerSort, schreyerSyzygy } from "../../module/syzygy";
import type { Vec } from "../../module/vector";
import { frameDivider } from "./frame-division";

/// The Schreyer resolution F_0 ← F_1 ← … of a module F_0 / ⟨g⟩: level k holds the columns of
/// d_k (vectors in F_{k−1}) and the degrees of the basis of F_k.
export interface SchreyerResolution<C> {
  readonly degrees: number[][];
  readonly orders: ModuleOrder[];
  /// cols[k] for k ≥ 1; cols[0] is empty.
  readonly cols: Vec<C>[][];
  /// Whether a degree bound dropped frame elements.
  truncatedDegree: boolean;
  /// Whether frame elements beyond the last computed level exist.
  truncatedLength: boolean;
}

export interface FrameBounds {
  /// Last homological degree whose differential is computed.
  readonly maxLevel: number;
  /// Largest internal degree kept.
  readonly maxDegree: number;
}

/// How the frame is computed, for tests that compare the ways.
export interface FrameStrategy {
  /// Divide with the general heap division (module/divide.ts) even where the integer-key
  /// division of frame-division.ts applies.
  generalDivision?: boolean;
  /// Release the columns of level k once level k + 1 is built and its scalar ranks read
  /// (callers that want only Betti numbers: the minimisation, which needs every level,
  /// never runs for them).
  dropFinishedLevels?: boolean;
}

/// Called when level k (the columns of d_k) is finished.
export type LevelDone<C> = (S: SchreyerResolution<C>, k: number) => void;

/// Computes the Schreyer frame level by level and, within a level, degree by degree: the
/// leading terms come from the previous level alone (Schreyer's theorem), the rest of each
/// syzygy by one heap division (R. La Scala, M. Stillman, "Strategies for computing minimal
/// free resolutions", J. Symbolic Comput. 26, 1998).
export function schreyerResolution<C>(
  R: RingCtx<C>,
  degrees0: readonly number[],
  order0: ModuleOrder,
  basis: readonly Vec<C>[],
  bounds: FrameBounds,
  opts: ComputeOptions | undefined,
  onLevel: LevelDone<C>,
  strategy: FrameStrategy = {},
): SchreyerResolution<C> {
  const S: SchreyerResolution<C> = {
    degrees: [[...degrees0]],
    orders: [order0],
    cols: [[]],
    truncatedDegree: false,
    truncatedLength: false,
  };
  firstLevel(S, basis, degrees0, order0, bounds);
  onLevel(S, 1);
  const at: Position = { level: 1, degree: 0, done: 0, total: 0 };
  const info = () => ({
    stage: "resolution",
    detail: `homological degree ${at.level + 1}, internal degree ${at.degree}`,
    fraction: at.total > 0 ? at.done / at.total : undefined,
  });
  const ticker = new Ticker(opts, info);
  for (; S.cols[at.level].length > 0; at.level++) {
    const level = at.level;
    const gens = S.cols[level];
    const frame = schreyerFrame(R, gens);
    if (level >= bounds.maxLevel) {
      if (frame.length > 0) S.truncatedLength = true;
      break;
    }
    const { kept, keptDegs } = withinDegreeBound(S, level, frame, bounds);
    checkLimit(opts, "maxBasisSize", kept.length, `the rank of the free module F_${level + 1}`);
    const cols = syzygiesOfLevel(R, S, level, gens, kept, keptDegs, { at, info, ticker, opts, strategy });
    S.degrees.push(keptDegs);
    S.orders.push(
      schreyerOrder(
        S.orders[level],
        kept.map((t) => ({ mono: t.mono, comp: t.i })),
      ),
    );
    S.cols.push(cols);
    onLevel(S, level + 1);
    // level + 1 divides the next level; level itself is read no more
    if (strategy.dropFinishedLevels) S.cols[level] = [];
  }
  return S;
}

/// Where the computation is, for progress reports.
interface Position {
  level: number;
  degree: number;
  done: number;
  total: number;
}

type FrameTerm = ReturnType<typeof schreyerFrame>[number];

/// Level 1: the Gröbner basis in Schreyer's sort order, cut at the degree bound.
function firstLevel<C>(
  S: SchreyerResolution<C>,
  basis: readonly Vec<C>[],
  degrees0: readonly number[],
  order0: ModuleOrder,
  bounds: FrameBounds,
): void {
  const perm = schreyerSort(basis);
  const first = perm.map((k) => basis[k]);
  const firstDegrees = first.map((v) => v.mono[0][1] + degrees0[v.comp[0]]);
  const keep = firstDegrees.map((d) => d <= bounds.maxDegree);
  if (keep.includes(false)) S.truncatedDegree = true;
  pushLevel(
    S,
    first.filter((_, k) => keep[k]),
    firstDegrees.filter((_, k) => keep[k]),
    order0,
  );
}

/// The frame's leading terms whose degree is within the bound (and their degrees).
function withinDegreeBound<C>(
  S: SchreyerResolution<C>,
  level: number,
  frame: readonly FrameTerm[],
  bounds: FrameBounds,
): { kept: FrameTerm[]; keptDegs: number[] } {
  const degs = frame.map((t) => t.mono[1] + S.degrees[level][t.i]);
  const kept = frame.filter((_, p) => degs[p] <= bounds.maxDegree);
  const keptDegs = degs.filter((d) => d <= bounds.maxDegree);
  if (kept.length < frame.length) S.truncatedDegree = true;
  return { kept, keptDegs };
}

/// The syzygies of one level, by increasing degree: each one's tail by one heap division in
/// the Schreyer order.
function syzygiesOfLevel<C>(
  R: RingCtx<C>,
  S: SchreyerResolution<C>,
  level: number,
  gens: readonly Vec<C>[],
  kept: readonly FrameTerm[],
  keptDegs: readonly number[],
  run: { at: Position; info: () => ProgressInfo; ticker: Ticker; opts: ComputeOptions | undefined; strategy: FrameStrategy },
): Vec<C>[] {
  const { at, info, ticker, opts, strategy } = run;
  const maxTerms = opts?.limits?.maxTerms ?? Infinity;
  const O = S.orders[level - 1];
  const next = S.orders[level];
  const D = divisorsOf(gens);
  // over a grevlex ring (term over position and its Schreyer orders): the same division on
  // integer keys (frame-division.ts)
  const fast = strategy.generalDivision ? null : frameDivider(R, O, gens, kept);
  const cols = new Array<Vec<C>>(kept.length);
  const byDegree = kept.map((_, p) => p).sort((a, b) => keptDegs[a] - keptDegs[b]);
  at.done = 0;
  at.total = kept.length;
  for (const p of byDegree) {
    if (keptDegs[p] !== at.degree || p === byDegree[0]) {
      at.degree = keptDegs[p];
      announce(opts, info());
    }
    const limit = opts?.limits?.maxDegree;
    if (limit !== undefined && at.degree > limit) {
      throw limitError("maxDegree", `the resolution reached internal degree ${at.degree}, above the limit maxDegree = ${limit}`);
    }
    checkpoint(opts, info);
    cols[p] = fast ? fast.syzygy(kept[p], next, ticker, maxTerms) : schreyerSyzygy(R, O, gens, D, next, kept[p], ticker, maxTerms);
    at.done++;
  }
  return cols;
}

function pushLevel<C>(S: SchreyerResolution<C>, cols: Vec<C>[], degs: number[], O: ModuleOrder): void {
  S.degrees.push(degs);
  S.cols.push(cols);
  S.orders.push(
    schreyerOrder(
      O,
      cols.map((g) => ({ mono: g.mono[0], comp: g.comp[0] })),
    ),
  );
}
