/// Reads an NDJSON response line by line, as the console does.
export async function* ndjsonEvents(response: Response): AsyncGenerator<Record<string, unknown>> {
  const reader = response.body!.getReader();
  const decoder = new TextDecoder();
  let buffer = "";
  for (;;) {
    const { done, value } = await reader.read();
    if (value) buffer += decoder.decode(value, { stream: true });
    let newline: number;
    while ((newline = buffer.indexOf("\n")) >= 0) {
      const line = buffer.slice(0, newline).trim();
      buffer = buffer.slice(newline + 1);
      if (line) yield JSON.parse(line) as Record<string, unknown>;
    }
    if (done) break;
  }
  if (buffer.trim()) yield JSON.parse(buffer) as Record<string, unknown>;
}

export async function allEvents(response: Response): Promise<Record<string, unknown>[]> {
  const events: Record<string, unknown>[] = [];
  for await (const e of ndjsonEvents(response)) events.push(e);
  return events;
}
