/// Reading the cell stream: POST the source, then read the NDJSON body line by line with
/// a ReadableStream reader, handing each parsed event on as it arrives.
import { errorOf } from "@/app/_client/fetch";
import type { CellEvent } from "@/lib/wire/reading";

/// Splits a byte stream into lines and parses each non-empty line as JSON. A line that
/// is not JSON is reported through `onBadLine` and skipped, so one garbled line does
/// not lose the rest of the cell.
export async function readNdjson(
  body: ReadableStream<Uint8Array>,
  onEvent: (event: CellEvent) => void,
  onBadLine: (line: string) => void = () => {},
): Promise<void> {
  const reader = body.getReader();
  const decoder = new TextDecoder();
  let buffered = "";
  const emit = (line: string) => {
    const trimmed = line.trim();
    if (trimmed === "") return;
    let parsed: unknown;
    try {
      parsed = JSON.parse(trimmed);
    } catch {
      onBadLine(trimmed);
      return;
    }
    if (typeof parsed === "object" && parsed !== null && typeof (parsed as { event?: unknown }).event === "string") {
      onEvent(parsed as CellEvent);
    } else onBadLine(trimmed);
  };
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    buffered += decoder.decode(value, { stream: true });
    let nl: number;
    while ((nl = buffered.indexOf("\n")) !== -1) {
      emit(buffered.slice(0, nl));
      buffered = buffered.slice(nl + 1);
    }
  }
  buffered += decoder.decode();
  emit(buffered);
}

/// Runs a cell: POSTs `{source}` and streams its events; rejects with an ApiError when
/// the server refuses (not signed in, no edit access, bad input, or 409 `redefines_others`
/// when the cell would replace a name someone else defined and `redefine` is not set).
export async function runCell(
  sessionId: string,
  source: string,
  onEvent: (event: CellEvent) => void,
  signal?: AbortSignal,
  options: { redefine?: boolean } = {},
): Promise<void> {
  const res = await fetch(`/api/sessions/${sessionId}/cells`, {
    method: "POST",
    headers: { "content-type": "application/json", accept: "application/x-ndjson" },
    body: JSON.stringify(options.redefine ? { source, redefine: true } : { source }),
    signal,
  });
  if (!res.ok) throw await errorOf(res);
  if (!res.body) throw new Error("The server sent no cell stream.");
  await readNdjson(res.body, onEvent);
}
