/// A message as the development SMTP sink stores it (one JSON file per message).
export interface StoredMessage {
  id: string;
  receivedAt: string;
  envelopeFrom: string | null;
  envelopeTo: string[];
  subject: string;
  from: string;
  to: string;
  text: string;
}

/// Splits a raw RFC 5322 message into unfolded headers and body. Enough for the sink's
/// mailbox view of the plain-text mail Ringside sends; not a general MIME parser.
export function parseRawMessage(raw: string): { headers: Map<string, string>; body: string } {
  const normalized = raw.replace(/\r\n/g, "\n");
  const split = normalized.indexOf("\n\n");
  const head = split === -1 ? normalized : normalized.slice(0, split);
  const body = split === -1 ? "" : normalized.slice(split + 2);
  const headers = new Map<string, string>();
  let last: string | null = null;
  for (const line of head.split("\n")) {
    if (/^[ \t]/.test(line) && last) {
      headers.set(last, `${headers.get(last)} ${line.trim()}`);
      continue;
    }
    const colon = line.indexOf(":");
    if (colon <= 0) continue;
    last = line.slice(0, colon).trim().toLowerCase();
    headers.set(last, line.slice(colon + 1).trim());
  }
  const encoding = headers.get("content-transfer-encoding")?.toLowerCase();
  return { headers, body: encoding === "quoted-printable" ? decodeQuotedPrintable(body) : body };
}

function decodeQuotedPrintable(text: string): string {
  const bytes = text.replace(/=\n/g, "").replace(/=([0-9A-F]{2})/gi, (_, hex: string) => String.fromCharCode(parseInt(hex, 16)));
  return Buffer.from(bytes, "latin1").toString("utf8");
}
