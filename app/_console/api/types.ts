/// The shapes the console reads from the HTTP API (app/api/README.md) and the §9 value
/// encoding (notation.md §9). Client-side types only: the client never imports the
/// server's schemas or the engine. Fields beyond §9 are optional, so a newer server
/// does not break an older page.
import type { SpanJson } from "../render/caret";

/// A §9 value: every value has a `type` and a human `text`; the other fields depend on
/// the type and are read defensively by the renderers.
export interface ValueJson {
  readonly type: string;
  readonly text: string;
  readonly value?: string | boolean;
  readonly gens?: readonly string[];
  readonly field?: string;
  readonly vars?: readonly string[];
  readonly degrees?: readonly number[];
  readonly order?: string;
  readonly ideal?: readonly string[];
  readonly rows?: readonly (readonly string[])[] | readonly (readonly ValueJson[])[];
  readonly presentation?: ValueJson | null;
  readonly ranks?: readonly number[];
  readonly betti?: readonly (readonly [number, number, number])[];
  readonly entries?: readonly (readonly [number, number, number])[];
  readonly complete?: boolean;
  readonly numerator?: readonly string[];
  readonly denominator?: string | readonly string[];
  readonly coefficients?: readonly string[];
  readonly rational?: string | null;
  /// additions of lib/notation: a value's warning in words; how many terms a guess fits
  readonly note?: string;
  readonly checked?: number;
  readonly items?: readonly ValueJson[];
  readonly fields?: Readonly<Record<string, ValueJson>>;
  readonly columns?: readonly string[];
  readonly ring?: ValueJson;
}

/// §9 Error.
export interface ErrorJson {
  readonly type: "Error";
  readonly text?: string;
  readonly kind: "parse" | "type" | "runtime" | "limit" | "cancelled";
  readonly message: string;
  readonly span: SpanJson;
}

export type CellStatus = "running" | "done" | "error" | "cancelled" | "interrupted";

/// One statement's result inside a cell. The contract names the statement's number
/// `index`; the stored cells of the first API version call it `statement`, so both are read.
export interface CellResult {
  readonly index?: number;
  readonly statement?: number;
  readonly span: SpanJson;
  readonly value: ValueJson;
}

export interface Cell {
  readonly id: string;
  readonly position: number;
  readonly source: string;
  readonly status: CellStatus;
  readonly results: readonly CellResult[];
  readonly error: ErrorJson | null;
  /// where a cancel, a limit or a lost server stopped the cell ("stopped after homological degree 6: …")
  readonly stopped?: string | null;
  readonly timings: { readonly totalMs: number | null } | null;
  readonly engineVersion?: string;
  readonly createdAt: string;
}

export interface NamedObject {
  readonly id: string;
  readonly name: string;
  readonly type: string;
  readonly value: ValueJson;
  readonly summary: string;
  readonly source: string;
  readonly sourceCellId: string | null;
  /// where an imported copy came from (a shared object or a JSON export); null otherwise
  readonly origin?: ObjectOrigin | null;
  readonly updatedAt: string;
}

export interface ObjectOrigin {
  readonly kind: string;
  readonly sessionTitle?: string;
  readonly name?: string;
  readonly ownerName?: string;
  readonly importedAt?: string;
}

export type Access = "owner" | "editor" | "viewer";

export interface SessionSummary {
  readonly id: string;
  readonly title: string;
  readonly ownerName: string;
  readonly access: Access;
  readonly updatedAt: string;
}

export interface SessionDetail {
  readonly id: string;
  readonly title: string;
  readonly ownerName: string;
  readonly visibility: string;
  readonly access: Access;
  readonly canEdit: boolean;
  /// the owner or a lead of the session's team: may change its shares and its link
  readonly canManageSharing?: boolean;
}

/// One line of the cell stream.
export type CellEvent =
  | { readonly event: "accepted"; readonly cellId: string; readonly position: number }
  | { readonly event: "checked"; readonly statements: number }
  | {
      readonly event: "progress";
      readonly statement: number;
      readonly stage: string;
      readonly detail?: string;
      readonly fraction?: number;
    }
  | { readonly event: "partial"; readonly statement: number; readonly value: ValueJson }
  | { readonly event: "result"; readonly statement: number; readonly span: SpanJson; readonly value: ValueJson }
  | { readonly event: "error"; readonly error: ErrorJson }
  | {
      readonly event: "done";
      readonly status: CellStatus;
      readonly timings: { readonly totalMs: number };
      readonly objects: readonly NamedObject[];
    };

/// The statement number of a result, whichever name the server used.
export const resultIndex = (r: CellResult, fallback: number): number => r.index ?? r.statement ?? fallback;
