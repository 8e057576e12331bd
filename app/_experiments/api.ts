/// Calls to the experiments API (app/api/README.md, "Experiments") for the room; every
/// read carries a read-only link's token when the visitor came with one.
import { errorOf, send, withLink } from "@/app/_client/fetch";
import type { Experiment, ExperimentSummary, Row, RowsPage, RowStatus, UploadPreview } from "./types";

export const experimentKeys = {
  list: "/api/experiments",
  /// one session's experiments, through the session's read-only link when the visitor has one
  /// (signed in or not); null (nothing to read) without a session, or signed out without a link
  ofSession: (sessionId: string | null, signedIn: boolean, link: string | null) =>
    sessionId && (signedIn || link) ? withLink(`/api/experiments?session=${sessionId}`, link) : null,
  one: (id: string, link: string | null) => withLink(`/api/experiments/${id}`, link),
  member: (id: string, index: number, link: string | null) => withLink(`/api/experiments/${id}/members/${index}`, link),
};

export interface RowQuery {
  offset: number;
  limit: number;
  sort: string;
  order: "asc" | "desc";
  status: readonly RowStatus[];
  where: readonly string[];
}

/// The address of one page of rows.
export function rowsUrl(id: string, q: RowQuery, link: string | null): string {
  const p = new URLSearchParams({ offset: String(q.offset), limit: String(q.limit), sort: q.sort, order: q.order });
  if (q.status.length > 0) p.set("status", q.status.join(","));
  for (const w of q.where) p.append("where", w);
  return withLink(`/api/experiments/${id}/rows?${p}`, link);
}

export const exportUrl = (id: string, format: "csv" | "json" | "latex", link: string | null) =>
  withLink(`/api/experiments/${id}/export?format=${format}`, link);

/// Every row in member order, read a page (the API's largest, 1000) at a time, up to `cap`.
export async function allRows(id: string, link: string | null, cap: number): Promise<{ rows: Row[]; matched: number }> {
  const rows: Row[] = [];
  let matched = 0;
  for (let offset = 0; offset < cap; offset += 1000) {
    const page = await send<RowsPage>(
      rowsUrl(id, { offset, limit: Math.min(1000, cap - offset), sort: "index", order: "asc", status: [], where: [] }, link),
    );
    rows.push(...page.rows);
    matched = page.matched;
    if (rows.length >= matched || page.rows.length === 0) break;
  }
  return { rows, matched };
}

export const listExperiments = () => send<{ experiments: ExperimentSummary[] }>(experimentKeys.list);

export const actOn = (id: string, action: "pause" | "resume" | "cancel" | "rerun") =>
  send<{ experiment: Experiment }>(`/api/experiments/${id}/${action}`, { method: "POST" });

export const createFromCell = (sessionId: string, cellId: string) =>
  send<{ experiment: Experiment }>("/api/experiments", { method: "POST", body: JSON.stringify({ sessionId, cellId }) });

export const createFromSource = (sessionId: string, source: string) =>
  send<{ experiment: Experiment }>("/api/experiments", { method: "POST", body: JSON.stringify({ sessionId, source }) });

export const previewUpload = (body: { format: "text" | "json"; ring: string; content: string }) =>
  send<{ preview: UploadPreview }>("/api/experiments/uploads/preview", { method: "POST", body: JSON.stringify(body) });

export const createUpload = (body: { sessionId: string; name: string; format: "text" | "json"; ring: string; content: string }) =>
  send<{ upload: { id: string; name: string; length: number } }>("/api/experiments/uploads", {
    method: "POST",
    body: JSON.stringify(body),
  });

export const createFromUpload = (body: { sessionId: string; uploadId: string; probe: string; ringName?: string }) =>
  send<{ experiment: Experiment }>("/api/experiments", { method: "POST", body: JSON.stringify(body) });

/// Runs `source` as a new cell of `sessionId` and waits for the cell's stream to end.
export async function runAsCell(sessionId: string, source: string): Promise<void> {
  const res = await fetch(`/api/sessions/${sessionId}/cells`, {
    method: "POST",
    headers: { "content-type": "application/json", accept: "application/x-ndjson" },
    body: JSON.stringify({ source }),
  });
  if (!res.ok) throw await errorOf(res);
  await res.text();
}
