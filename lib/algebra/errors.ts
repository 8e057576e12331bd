/// Every failure the engine raises on purpose.
/// kind "runtime": bad input or an impossible request; "limit": a ComputeOptions limit was
/// reached (`limit` names it); "cancelled": the abort signal fired.
export type AlgebraErrorKind = "runtime" | "limit" | "cancelled";

export class AlgebraError extends Error {
  readonly kind: AlgebraErrorKind;
  readonly limit?: string;
  /// For text input (parsePoly): 0-based offset of the offending character.
  readonly offset?: number;

  constructor(kind: AlgebraErrorKind, message: string, extra?: { limit?: string; offset?: number }) {
    super(message);
    this.name = "AlgebraError";
    this.kind = kind;
    if (extra?.limit !== undefined) this.limit = extra.limit;
    if (extra?.offset !== undefined) this.offset = extra.offset;
  }
}

/// A bad-input error naming the function that raised it ("gf: 12 is not prime").
export function runtimeError(where: string, message: string, offset?: number): AlgebraError {
  return new AlgebraError("runtime", `${where}: ${message}`, offset === undefined ? undefined : { offset });
}

export function limitError(limit: string, message: string): AlgebraError {
  return new AlgebraError("limit", message, { limit });
}
