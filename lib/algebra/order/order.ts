import { runtimeError } from "../errors";
import { HEAD, type Mono } from "../monomial/monomial";

/// Read once: an imported binding may be a getter in transpiled code, too slow for hot loops.
const H = HEAD;
/// Monomial orders. The first variable is the largest. "weights" compares w·e first and
/// breaks ties by grevlex; grevlex and glex compare the grading's (weighted) degree first.
export type OrderSpec = { kind: "grevlex" } | { kind: "lex" } | { kind: "glex" } | { kind: "weights"; weights: number[] };

/// Positive when a > b, negative when a < b, 0 when equal.
export type MonoCompare = (a: Mono, b: Mono) => number;

function revlexTail(a: Mono, b: Mono): number {
  for (let i = a.length - 1; i >= H; i--) {
    const d = b[i] - a[i];
    if (d !== 0) return d;
  }
  return 0;
}

function lexTail(a: Mono, b: Mono): number {
  for (let i = H, len = a.length; i < len; i++) {
    const d = a[i] - b[i];
    if (d !== 0) return d;
  }
  return 0;
}

const grevlex: MonoCompare = (a, b) => {
  const d = a[0] - b[0];
  return d !== 0 ? d : revlexTail(a, b);
};

const glex: MonoCompare = (a, b) => {
  const d = a[0] - b[0];
  return d !== 0 ? d : lexTail(a, b);
};

const weighted: MonoCompare = (a, b) => {
  const d = a[0] - b[0];
  if (d !== 0) return d;
  const e = a[1] - b[1];
  return e !== 0 ? e : revlexTail(a, b);
};

export function comparatorFor(order: OrderSpec): MonoCompare {
  switch (order.kind) {
    case "grevlex":
      return grevlex;
    case "glex":
      return glex;
    case "lex":
      return lexTail;
    case "weights":
      return weighted;
  }
}

/// Checks an order against the number of variables; weights must be non-negative integers
/// so that, with the grevlex tie-break, the order is a well-order.
export function validateOrder(order: OrderSpec, n: number): void {
  const kinds = ["grevlex", "lex", "glex", "weights"];
  if (!order || !kinds.includes(order.kind)) {
    throw runtimeError("polyRing", `unknown monomial order ${JSON.stringify(order)}; use grevlex, lex, glex or weights`);
  }
  if (order.kind === "weights") {
    const w = order.weights;
    if (!Array.isArray(w) || w.length !== n) {
      throw runtimeError("polyRing", `weights(…) needs ${n} weights, one per variable, got ${Array.isArray(w) ? w.length : "none"}`);
    }
    w.forEach((x, i) => {
      if (!Number.isInteger(x) || x < 0 || x > 1 << 20) {
        throw runtimeError("polyRing", `weight ${i + 1} must be an integer between 0 and 2^20, got ${x}`);
      }
    });
  }
}

export function orderName(order: OrderSpec): string {
  return order.kind === "weights" ? `weights(${order.weights.join(",")})` : order.kind;
}
