/// Large values stay in the engine slot's world: a value whose encoding is above
/// `largeValueBytes` is written to the detail folder and replaced, in every event the slot
/// sends, by a summary with a "detail on request" marker — a Complex keeps its ranks and Betti
/// table, anything else becomes a line saying what it is. The web server stores and sends
/// only the summary (GET …/details/:id streams the detail from disk); a later cell that uses
/// the value gets it back from the detail file inside its slot.
import { createHash } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, renameSync, utimesSync, writeFileSync } from "node:fs";
import path from "node:path";
import { formatLimit, limitValue } from "../limits";

export interface DetailMarker {
  id: string;
  bytes: number;
  type: string;
}

const ID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;

/// Where details are kept: RINGSIDE_DETAIL_DIR, else .data/details under the project.
export function detailDirectory(): string {
  return process.env.RINGSIDE_DETAIL_DIR ?? path.join(process.env.RINGSIDE_ROOT ?? process.cwd(), ".data", "details");
}

export function detailPath(id: string): string | null {
  return ID.test(id) ? path.join(detailDirectory(), `${id}.json`) : null;
}

export function detailOf(value: unknown): DetailMarker | null {
  const d = (value as { detail?: Partial<DetailMarker> } | null)?.detail;
  return d && typeof d.id === "string" && ID.test(d.id) && typeof d.bytes === "number" && typeof d.type === "string"
    ? (d as DetailMarker)
    : null;
}

function megabytes(bytes: number): string {
  return bytes >= 1024 * 1024 ? `${(bytes / (1024 * 1024)).toFixed(1)} MB` : `${Math.ceil(bytes / 1024)} KB`;
}

/// The value itself when small; otherwise its summary (the detail is written first): a
/// Complex (maps: null) or a Str, both with the extra `detail` marker.
export function bounded<T>(value: T): T {
  if (value === null || typeof value !== "object") return value;
  const threshold = limitValue("largeValueBytes");
  const json = JSON.stringify(value);
  if (json.length <= threshold) return value;
  const v = value as { type?: string; text?: string; ranks?: unknown; betti?: unknown; complete?: unknown; ring?: unknown; note?: string };
  const type = typeof v.type === "string" ? v.type : "Value";
  // Named by its content, so the same value sent twice (as a result and as a binding) is one file.
  const hex = createHash("sha256").update(json).digest("hex");
  const id = `${hex.slice(0, 8)}-${hex.slice(8, 12)}-${hex.slice(12, 16)}-${hex.slice(16, 20)}-${hex.slice(20, 32)}`;
  const dir = detailDirectory();
  mkdirSync(dir, { recursive: true, mode: 0o700 });
  const file = path.join(dir, `${id}.json`);
  const write = () => {
    const tmp = `${file}.${process.pid}.tmp`;
    writeFileSync(tmp, json, { mode: 0o600 });
    renameSync(tmp, file);
  };
  if (!existsSync(file)) write();
  else {
    // Touched, so pruning (lib/sessions/details.ts) keeps a file that a running cell is about
    // to hold again even when the last stored value holding it is deleted meanwhile.
    const now = new Date();
    try {
      utimesSync(file, now, now);
    } catch {
      write(); // pruned between the two calls
    }
  }
  const detail: DetailMarker = { id, bytes: json.length, type };
  const why = `this ${type} takes ${megabytes(json.length)}, above ${formatLimit("largeValueBytes", threshold)} (largeValueBytes): it is kept as a summary, its detail on request`;
  const head = typeof v.text === "string" ? v.text.slice(0, 2000) : "";
  if (type === "Complex") {
    // The ranks and Betti table are small; the differentials are the bulk.
    const note = v.note ? `${v.note}; ${why}` : why;
    const text = `${head.length < (v.text ?? "").length ? head + "…" : head} (${why})`;
    return { type, text, ranks: v.ranks, betti: v.betti, complete: v.complete, maps: null, note, ring: v.ring, detail } as T;
  }
  return { type: "Str", value: `${type}: ${why}`, text: `${head}… (${why})`, detail } as T;
}

/// The whole value back from a summary (inside a slot, for a later cell's bindings).
export function restored(value: unknown): unknown {
  const detail = detailOf(value);
  if (!detail) return value;
  const file = detailPath(detail.id);
  if (!file) return value;
  return JSON.parse(readFileSync(file, "utf8"));
}
