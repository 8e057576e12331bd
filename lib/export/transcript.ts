/// The transcript as the exporters see it: plain data read from the stored rows, with
/// each result's notation.md §9 JSON left as it was stored. No database, no engine.

export interface ValueJsonLike {
  type: string;
  text: string;
  [field: string]: unknown;
}

export interface TranscriptResult {
  statement: number;
  value: ValueJsonLike;
}

export interface TranscriptCell {
  position: number;
  source: string;
  status: string;
  results: TranscriptResult[];
  error: { kind?: string; message?: string } | null;
}

export interface TranscriptObject {
  name: string;
  type: string;
  value: ValueJsonLike;
  source: string;
}

export interface Transcript {
  title: string;
  ownerName: string;
  exportedAt: string;
  cells: TranscriptCell[];
  objects: TranscriptObject[];
}

function isValue(v: unknown): v is ValueJsonLike {
  return typeof v === "object" && v !== null && typeof (v as { type?: unknown }).type === "string";
}

/// The statements of a stored cell result (`{statements: [{statement|index, span, value}]}`).
export function statementsOf(result: unknown): TranscriptResult[] {
  const list = (result as { statements?: unknown } | null)?.statements;
  if (!Array.isArray(list)) return [];
  return list.flatMap((s, i) => {
    const r = s as { statement?: unknown; index?: unknown; value?: unknown };
    if (!isValue(r.value)) return [];
    const n = typeof r.statement === "number" ? r.statement : typeof r.index === "number" ? r.index : i;
    const value = { ...r.value, text: typeof r.value.text === "string" ? r.value.text : "" };
    return [{ statement: n, value }];
  });
}
