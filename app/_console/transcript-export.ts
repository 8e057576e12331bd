/// Downloading a transcript export (GET /api/sessions/:id/export) as a file, with the name
/// the server proposes.
import { errorOf } from "@/app/_client/fetch";
import { exportUrl, type ExportFormat } from "./api/client";

export const EXPORT_LABEL: Record<ExportFormat, string> = { latex: "LaTeX", markdown: "Markdown", json: "JSON" };
const EXPORT_EXT: Record<ExportFormat, string> = { latex: "tex", markdown: "md", json: "json" };

/// The file name the server proposes (Content-Disposition), else `fallback`.
function fileNameOf(res: Response, fallback: string): string {
  const m = /filename="([^"]+)"/.exec(res.headers.get("content-disposition") ?? "");
  return m?.[1] ?? fallback;
}

/// Fetches the export and hands it to the browser as a download; returns the words for
/// the notice line (the file name, or why it failed). Throws only when the network does.
export async function downloadTranscript(sessionId: string, format: ExportFormat, link: string | null): Promise<string> {
  const res = await fetch(exportUrl(sessionId, format, link));
  if (!res.ok) return `Export failed: ${(await errorOf(res)).message}`;
  const blob = await res.blob();
  const a = document.createElement("a");
  a.href = URL.createObjectURL(blob);
  a.download = fileNameOf(res, `transcript.${EXPORT_EXT[format]}`);
  a.click();
  URL.revokeObjectURL(a.href);
  return `Transcript exported as ${EXPORT_LABEL[format]} (${a.download}).`;
}
