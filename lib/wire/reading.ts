/// The contract as a tolerant reader sees it. The console must not break when a server
/// of another version adds a value type or leaves out a field, so it reads the same shapes
/// (derived here from the schemas' types, not written again) with every value loosened:
/// `type` and `text` always, any other field of any §9 type optional, the type name open.
import type { Cell as CellWire, CellEvent as CellEventWire, CellResult as CellResultWire } from "./cells";
import type { NamedObject as NamedObjectWire } from "./sessions";
import type { ErrorJson, ValueJson } from "./values";

type KeysOfUnion<U> = U extends unknown ? keyof U : never;
type FieldOf<U, K extends PropertyKey> = U extends unknown ? (K extends keyof U ? U[K] : never) : never;

/// A value as the console reads it.
export type ValueReading = { readonly type: string; readonly text: string } & {
  readonly [K in Exclude<KeysOfUnion<ValueJson>, "type" | "text">]?: Reading<FieldOf<ValueJson, K>>;
};

/// `T` with every value inside it loosened to a ValueReading, and everything read-only.
export type Reading<T> = T extends ErrorJson
  ? T
  : T extends ValueJson
    ? ValueReading
    : T extends object
      ? { readonly [K in keyof T]: Reading<T[K]> }
      : T;

export type Cell = Reading<CellWire>;
export type CellResult = Reading<CellResultWire>;
export type CellEvent = Reading<CellEventWire>;
export type NamedObject = Reading<NamedObjectWire>;
export type { Access, ObjectOrigin, SessionDetail, SessionSummary } from "./sessions";
export type { CellStatus } from "./cells";
export type { ErrorJson, SpanJson } from "./values";

/// The statement number of a result, whichever name the server used (`index` in the
/// contract, `statement` in cells stored by the first API version).
export const resultIndex = (r: CellResult, fallback: number): number => r.index ?? r.statement ?? fallback;
