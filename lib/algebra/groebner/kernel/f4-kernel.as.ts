// AssemblyScript source of the WebAssembly kernel of the F4 matrix reduction over GF(p),
// p < 2^31 (see ../f4-linalg.ts for the block form it computes and ../f4-kernel.ts for the
// memory layout the caller writes). Built by `npm run build:f4-kernel`
// (lib/ops/build-f4-kernel.mjs) into ../f4-kernel-wasm.ts; excluded from the TypeScript
// project (it uses AssemblyScript's machine types: u32, i64, v128).
//
// Rows being reduced are held eight at a time in one dense accumulator, the eight values of a
// column side by side (64-bit lanes, one 64-byte cache line a column), so every entry of a
// sparse pivot row is read once for eight rows and applied with four 128-bit SIMD
// multiply-adds. Arithmetic is exact in 64-bit integers with delayed modular reduction
// (common practice in finite-field linear algebra; e.g. J.-G. Dumas, P. Giorgi, C. Pernet,
// "Dense linear algebra over word-size prime fields: the FFLAS and FFPACK packages",
// ACM TOMS 35, 2008 — from memory):
//   mode 0 (p < 2^24): lanes are unsigned sums of products (p − v)·a < p², reduced modulo p
//     only after `budget` row operations (the caller computes it so no sum reaches 2^64);
//   mode 1 (any p < 2^31): lanes stay in [0, p²): a product v·a < p² < 2^62 is subtracted
//     and p² added back when the difference is negative (one compare per product).
// Nothing here allocates: the caller lays every array out in linear memory; only the rows
// of the echelon form grow past it (memory.grow, reported as −2 when refused).

// One row description (12 bytes): byte address of its column indices (u32), its length,
// byte address of its residues (u32). A pivot row's first entry is its leading one (1).

let P: u64 = 0;
let P2: i64 = 0;
let PINV: f64 = 0;
let MODE: i32 = 0;
let BUDGET: i32 = 1;
let NA: i32 = 0;
let NC: i32 = 0;
let NB: i32 = 0;
/// Row descriptions of the pivot rows, indexed by pivot column.
let PIV: usize = 0;
/// Dense accumulator of eight rows: column c at ACC + 64·c, row r in lane r (i64).
let ACC: usize = 0;
/// Staged B-parts of the eight rows of the last block: row r's columns at STAGE + r·8·NB,
/// its residues NB·4 bytes further; lengths at STAGE_LEN + 4r.
let STAGE: usize = 0;
let STAGE_LEN: usize = 0;
/// One dense row of NB lanes (i64) for the echelon step.
let DENSE: usize = 0;
/// Echelon rows by leading B column: byte address (0: none) and length; a row stores its
/// columns then its residues.
let ETAB: usize = 0;
/// Next free byte for echelon rows.
let BUMP: usize = 0;
/// Whether reduceBlock also reduces by the echelon rows (off for the tails of a basis).
let ECHELON: bool = false;
let LAST_PTR: usize = 0;
let LAST_LEN: i32 = 0;

export function setup(
  p: u32,
  mode: i32,
  budget: i32,
  nA: i32,
  ncols: i32,
  piv: usize,
  acc: usize,
  stage: usize,
  stageLen: usize,
  dense: usize,
  etab: usize,
  bump: usize,
): void {
  P = p as u64;
  P2 = (P * P) as i64;
  PINV = 1.0 / (p as f64);
  MODE = mode;
  BUDGET = budget;
  NA = nA;
  NC = ncols;
  NB = ncols - nA;
  PIV = piv;
  ACC = acc;
  STAGE = stage;
  STAGE_LEN = stageLen;
  DENSE = dense;
  ETAB = etab;
  BUMP = bump;
}

/// The first byte not used by this module's own data (the caller starts above it).
export function heapBase(): usize {
  return __heap_base;
}

export function setEchelon(on: bool): void {
  ECHELON = on;
}

export function lastPtr(): usize {
  return LAST_PTR;
}

export function lastLen(): i32 {
  return LAST_LEN;
}

export function bump(): usize {
  return BUMP;
}

/// x mod p for any x < 2^64: a floating quotient, then at most a few corrections.
@inline
function modp(x: u64): u64 {
  const q = <u64>(<f64>x * PINV);
  let r = <i64>(x - q * P);
  while (r < 0) r += <i64>P;
  while (r >= <i64>P) r -= <i64>P;
  return <u64>r;
}

/// Reduces every lane of columns [from, NC) modulo p (mode 0, when the budget is used up).
function normalise(from: i32): void {
  for (let c = from; c < NC; c++) {
    const a = ACC + ((<usize>c) << 6);
    for (let r: usize = 0; r < 8; r++) {
      const x = load<u64>(a + (r << 3));
      if (x >= P) store<u64>(a + (r << 3), modp(x));
    }
  }
}

/// The multipliers of four lanes (i64) as the low halves of an i32x4: v mod p, or p − v in
/// mode 0 (which adds where mode 1 subtracts).
@inline
function multipliers(x0: v128, x1: v128): v128 {
  let v0 = <u32>modp(i64x2.extract_lane(x0, 0));
  let v1 = <u32>modp(i64x2.extract_lane(x0, 1));
  let v2 = <u32>modp(i64x2.extract_lane(x1, 0));
  let v3 = <u32>modp(i64x2.extract_lane(x1, 1));
  if (MODE == 0) {
    const p = <u32>P;
    if (v0 != 0) v0 = p - v0;
    if (v1 != 0) v1 = p - v1;
    if (v2 != 0) v2 = p - v2;
    if (v3 != 0) v3 = p - v3;
  }
  let m = i32x4.splat(0);
  m = i32x4.replace_lane(m, 0, v0);
  m = i32x4.replace_lane(m, 1, v1);
  m = i32x4.replace_lane(m, 2, v2);
  m = i32x4.replace_lane(m, 3, v3);
  return m;
}

/// Adds the multiples (multipliers mA, mB) of the tail of one sparse row — columns at cp,
/// residues at vp, entries [1, len), columns shifted by `shift` — to the eight lanes.
@inline
function applyRow(mA: v128, mB: v128, cp: usize, vp: usize, len: usize, shift: usize): void {
  const acc = ACC + (shift << 6);
  if (MODE == 0) {
    for (let k: usize = 1; k < len; k++) {
      const t = acc + ((<usize>load<u32>(cp + (k << 2))) << 6);
      const w = v128.load32_splat(vp + (k << 2));
      v128.store(t, i64x2.add(v128.load(t), i64x2.extmul_low_i32x4_u(mA, w)));
      v128.store(t, i64x2.add(v128.load(t, 16), i64x2.extmul_high_i32x4_u(mA, w)), 16);
      v128.store(t, i64x2.add(v128.load(t, 32), i64x2.extmul_low_i32x4_u(mB, w)), 32);
      v128.store(t, i64x2.add(v128.load(t, 48), i64x2.extmul_high_i32x4_u(mB, w)), 48);
    }
  } else {
    const zero = i64x2.splat(0);
    const p2 = i64x2.splat(P2);
    for (let k: usize = 1; k < len; k++) {
      const t = acc + ((<usize>load<u32>(cp + (k << 2))) << 6);
      const w = v128.load32_splat(vp + (k << 2));
      let y0 = i64x2.sub(v128.load(t), i64x2.extmul_low_i32x4_u(mA, w));
      let y1 = i64x2.sub(v128.load(t, 16), i64x2.extmul_high_i32x4_u(mA, w));
      let y2 = i64x2.sub(v128.load(t, 32), i64x2.extmul_low_i32x4_u(mB, w));
      let y3 = i64x2.sub(v128.load(t, 48), i64x2.extmul_high_i32x4_u(mB, w));
      y0 = i64x2.add(y0, v128.and(i64x2.lt_s(y0, zero), p2));
      y1 = i64x2.add(y1, v128.and(i64x2.lt_s(y1, zero), p2));
      y2 = i64x2.add(y2, v128.and(i64x2.lt_s(y2, zero), p2));
      y3 = i64x2.add(y3, v128.and(i64x2.lt_s(y3, zero), p2));
      v128.store(t, y0);
      v128.store(t, y1, 16);
      v128.store(t, y2, 32);
      v128.store(t, y3, 48);
    }
  }
}

/// The multiplier of lane r (0 ≤ r < 8).
function lane(mA: v128, mB: v128, r: i32): u64 {
  switch (r) {
    case 0:
      return <u64>(<u32>i32x4.extract_lane(mA, 0));
    case 1:
      return <u64>(<u32>i32x4.extract_lane(mA, 1));
    case 2:
      return <u64>(<u32>i32x4.extract_lane(mA, 2));
    case 3:
      return <u64>(<u32>i32x4.extract_lane(mA, 3));
    case 4:
      return <u64>(<u32>i32x4.extract_lane(mB, 0));
    case 5:
      return <u64>(<u32>i32x4.extract_lane(mB, 1));
    case 6:
      return <u64>(<u32>i32x4.extract_lane(mB, 2));
    default:
      return <u64>(<u32>i32x4.extract_lane(mB, 3));
  }
}

/// applyRow for lane r alone, multiplier m.
function applyLane(m: u64, cp: usize, vp: usize, len: usize, shift: usize, r: usize): void {
  const acc = ACC + (shift << 6) + (r << 3);
  if (MODE == 0) {
    for (let k: usize = 1; k < len; k++) {
      const t = acc + ((<usize>load<u32>(cp + (k << 2))) << 6);
      store<u64>(t, load<u64>(t) + m * <u64>load<u32>(vp + (k << 2)));
    }
  } else {
    for (let k: usize = 1; k < len; k++) {
      const t = acc + ((<usize>load<u32>(cp + (k << 2))) << 6);
      let y = load<i64>(t) - <i64>(m * <u64>load<u32>(vp + (k << 2)));
      if (y < 0) y += P2;
      store<i64>(t, y);
    }
  }
}

/// Reduces `count` ≤ 8 rows (descriptions at `rows`, combined column numbering) by the pivot
/// rows, then by the echelon rows found so far, and stages their B-parts (renumbered from
/// 0, increasing, residues in [1, p)). Reducing by the echelon rows here, eight rows at a
/// time, leaves echelonRow only the rows found within the block: the result is the same,
/// as a row reduced by a set of rows with distinct leading columns until it vanishes at all
/// of them is unique.
export function reduceBlock(rows: usize, count: i32): void {
  let first: i32 = NC;
  for (let r = 0; r < count; r++) {
    const e = rows + 12 * <usize>r;
    const cp = <usize>load<u32>(e),
      len = <usize>load<u32>(e, 4),
      vp = <usize>load<u32>(e, 8);
    for (let k: usize = 0; k < len; k++) {
      const c = load<u32>(cp + (k << 2));
      store<u64>(ACC + ((<usize>c) << 6) + ((<usize>r) << 3), <u64>load<u32>(vp + (k << 2)));
      if (<i32>c < first) first = <i32>c;
    }
  }
  const zero = i64x2.splat(0);
  let ops = 0;
  for (let c = first; c < NC; c++) {
    const a = ACC + ((<usize>c) << 6);
    let cp: usize, len: usize, vp: usize, shift: usize;
    if (c < NA) {
      const e = PIV + 12 * <usize>c;
      cp = <usize>load<u32>(e);
      len = <usize>load<u32>(e, 4);
      vp = <usize>load<u32>(e, 8);
      shift = 0;
    } else {
      if (!ECHELON) break;
      const e = ETAB + ((<usize>(c - NA)) << 3);
      cp = <usize>load<u32>(e);
      if (cp == 0) continue;
      len = <usize>load<u32>(e, 4);
      vp = cp + (len << 2);
      shift = <usize>NA;
    }
    const x0 = v128.load(a),
      x1 = v128.load(a, 16),
      x2 = v128.load(a, 32),
      x3 = v128.load(a, 48);
    if (!v128.any_true(v128.or(v128.or(x0, x1), v128.or(x2, x3)))) continue;
    v128.store(a, zero);
    v128.store(a, zero, 16);
    v128.store(a, zero, 32);
    v128.store(a, zero, 48);
    const mA = multipliers(x0, x1),
      mB = multipliers(x2, x3);
    const lanes = i32x4.bitmask(i32x4.ne(mA, zero)) | (i32x4.bitmask(i32x4.ne(mB, zero)) << 4);
    if (lanes == 0) continue;
    if (popcnt(lanes) <= 2) {
      // One or two rows of the block meet this pivot row (sparse rows): lane by lane is
      // cheaper than all eight lanes.
      let bits = lanes;
      while (bits != 0) {
        const r = ctz(bits);
        bits &= bits - 1;
        applyLane(lane(mA, mB, r), cp, vp, len, shift, <usize>r);
      }
    } else applyRow(mA, mB, cp, vp, len, shift);
    if (MODE == 0 && ++ops == BUDGET) {
      normalise(c + 1);
      ops = 0;
    }
  }
  // The B-parts, staged; the accumulator is left zero.
  const from = first > NA ? first : NA;
  for (let r = 0; r < 8; r++) {
    const sc = STAGE + (<usize>r) * 8 * <usize>NB;
    const sv = sc + 4 * <usize>NB;
    let n: usize = 0;
    if (r < count) {
      for (let c = from; c < NC; c++) {
        const a = ACC + ((<usize>c) << 6) + ((<usize>r) << 3);
        const x = load<u64>(a);
        if (x == 0) continue;
        store<u64>(a, 0);
        const v = modp(x);
        if (v == 0) continue;
        store<u32>(sc + (n << 2), <u32>(c - NA));
        store<u32>(sv + (n << 2), <u32>v);
        n++;
      }
    }
    store<u32>(STAGE_LEN + ((<usize>r) << 2), <u32>n);
  }
}

/// v^(−1) mod p for 0 < v < p (extended Euclid).
function invMod(v: u64): u64 {
  let a = <i64>v,
    b = <i64>P,
    x: i64 = 1,
    y: i64 = 0;
  while (b != 0) {
    const q = a / b;
    let t = a - q * b;
    a = b;
    b = t;
    t = x - q * y;
    x = y;
    y = t;
  }
  return <u64>(x < 0 ? x + <i64>P : x);
}

/// Reduces the staged row r by the echelon rows found so far; when something is left, it is
/// made monic and stored as a new echelon row (lastPtr/lastLen). Returns its leading B
/// column, −1 when the row reduced to zero, −2 when memory could not grow.
export function echelonRow(r: i32): i32 {
  const n = <usize>load<u32>(STAGE_LEN + ((<usize>r) << 2));
  if (n == 0) return -1;
  const sc = STAGE + (<usize>r) * 8 * <usize>NB;
  const sv = sc + 4 * <usize>NB;
  for (let k: usize = 0; k < n; k++) store<u64>(DENSE + ((<usize>load<u32>(sc + (k << 2))) << 3), <u64>load<u32>(sv + (k << 2)));
  const first = <i32>load<u32>(sc);
  const p = <u32>P;
  let lead = -1,
    kept: usize = 0,
    ops = 0;
  for (let c = first; c < NB; c++) {
    const a = DENSE + ((<usize>c) << 3);
    const x = load<u64>(a);
    if (x == 0) continue;
    const v = <u32>modp(x);
    const e = ETAB + ((<usize>c) << 3);
    const ptr = <usize>load<u32>(e);
    if (ptr == 0) {
      store<u64>(a, <u64>v);
      if (v != 0) {
        if (lead < 0) lead = c;
        kept++;
      }
      continue;
    }
    store<u64>(a, 0);
    if (v == 0) continue;
    const len = <usize>load<u32>(e, 4);
    const vals = ptr + (len << 2);
    if (MODE == 0) {
      const m = <u64>(p - v);
      for (let k: usize = 1; k < len; k++) {
        const t = DENSE + ((<usize>load<u32>(ptr + (k << 2))) << 3);
        store<u64>(t, load<u64>(t) + m * <u64>load<u32>(vals + (k << 2)));
      }
      if (++ops == BUDGET) {
        for (let j = c + 1; j < NB; j++) {
          const t = DENSE + ((<usize>j) << 3);
          const y = load<u64>(t);
          if (y >= P) store<u64>(t, modp(y));
        }
        ops = 0;
      }
    } else {
      const m = <u64>v;
      for (let k: usize = 1; k < len; k++) {
        const t = DENSE + ((<usize>load<u32>(ptr + (k << 2))) << 3);
        let y = load<i64>(t) - <i64>(m * <u64>load<u32>(vals + (k << 2)));
        if (y < 0) y += P2;
        store<i64>(t, y);
      }
    }
  }
  if (lead < 0) return -1;
  const need = kept << 3;
  const end = BUMP + need;
  const have = (<usize>memory.size()) << 16;
  if (end > have) {
    const pages = <i32>((end - have + 0xffff) >> 16);
    if (memory.grow(pages) < 0) {
      for (let c = lead; c < NB; c++) store<u64>(DENSE + ((<usize>c) << 3), 0);
      return -2;
    }
  }
  const out = BUMP;
  const outVals = out + (kept << 2);
  const inv = invMod(load<u64>(DENSE + ((<usize>lead) << 3)));
  let k: usize = 0;
  for (let c = lead; k < kept; c++) {
    const a = DENSE + ((<usize>c) << 3);
    const v = load<u64>(a);
    if (v == 0) continue;
    store<u64>(a, 0);
    store<u32>(out + (k << 2), <u32>c);
    store<u32>(outVals + (k << 2), <u32>modp(v * inv));
    k++;
  }
  BUMP = end;
  store<u32>(ETAB + ((<usize>lead) << 3), <u32>out);
  store<u32>(ETAB + ((<usize>lead) << 3), <u32>kept, 4);
  LAST_PTR = out;
  LAST_LEN = <i32>kept;
  return lead;
}
