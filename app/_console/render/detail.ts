/// A value too large to keep whole on the web server (`largeValueBytes`) is stored as a
/// summary carrying a marker `detail: {id, bytes, type}` (lib/compute/large-values.ts); the
/// whole value is fetched on request from GET /api/sessions/:id/details/:detailId. These pure
/// helpers read the marker, say its size in words, name the downloaded file and turn a
/// refusal into a sentence (unit-tested in tests/console/detail.test.ts).
import type { ValueReading } from "@/lib/wire/reading";

export interface DetailMarker {
  readonly id: string;
  /// the length of the whole value's JSON text
  readonly bytes: number;
  /// the whole value's type (a summary may be a Str standing in for a Matrix, …)
  readonly type: string;
}

const ID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/;

/// The marker of a summarised value, or null for a value that is whole (or a marker that is
/// malformed: the console then draws the summary alone rather than offer a broken control).
export function detailOfValue(v: ValueReading): DetailMarker | null {
  const d = (v as { detail?: unknown }).detail;
  if (typeof d !== "object" || d === null) return null;
  const { id, bytes, type } = d as { id?: unknown; bytes?: unknown; type?: unknown };
  if (typeof id !== "string" || !ID.test(id)) return null;
  if (typeof bytes !== "number" || !Number.isSafeInteger(bytes) || bytes < 0) return null;
  return { id, bytes, type: typeof type === "string" && type !== "" ? type : v.type };
}

/// "812 bytes", "80.2 KB", "14.6 MB" (powers of 1024, as the server's own note counts).
export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} bytes`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(1)} KB`;
  if (bytes < 1024 * 1024 * 1024) return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
  return `${(bytes / (1024 * 1024 * 1024)).toFixed(2)} GB`;
}

/// Above this the console warns before drawing the whole value in the page (download instead).
export const HEAVY_TO_DRAW_BYTES = 8 * 1024 * 1024;

/// The file name offered for a download: the value's type and the start of its id.
export function detailFileName(marker: DetailMarker): string {
  const type = marker.type.replace(/[^A-Za-z0-9]+/g, "-").replace(/^-|-$/g, "") || "value";
  return `ringside-${type.toLowerCase()}-${marker.id.slice(0, 8)}.json`;
}

/// What to tell the reader when the detail could not be fetched, by the HTTP status (the
/// server's own message is added when there is one).
export function detailProblem(status: number, serverMessage?: string): string {
  const said = serverMessage && serverMessage.trim() !== "" ? ` (${serverMessage.trim().replace(/\.$/, "")}.)` : "";
  switch (status) {
    case 401:
      return `Sign in again to fetch the full value.${said}`;
    case 403:
      return `You may no longer read this session's values, so the full value cannot be fetched.${said}`;
    case 404:
      return `The full value is not stored on this server: it was deleted with the value it belonged to, or this session came from an import or another server.${said}`;
    default:
      return status === 0
        ? `The full value could not be fetched: the server did not answer.${said}`
        : `The full value could not be fetched: the server answered ${status}.${said}`;
  }
}
