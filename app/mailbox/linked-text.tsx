/// A message's plain text with its web addresses as links (an invitation mail's link must
/// be clickable in the mailbox); everything else stays text, so nothing in a message is
/// interpreted as markup.
import { Fragment } from "react";

const URL_PATTERN = /https?:\/\/[^\s<>"']+[^\s<>"'.,;:!?)\]]/g;

export function LinkedText({ text }: { text: string }) {
  const parts: React.ReactNode[] = [];
  let last = 0;
  for (const m of text.matchAll(URL_PATTERN)) {
    const at = m.index ?? 0;
    if (at > last) parts.push(<Fragment key={`t${at}`}>{text.slice(last, at)}</Fragment>);
    parts.push(
      <a key={`a${at}`} href={m[0]} className="break-all text-ink underline">
        {m[0]}
      </a>,
    );
    last = at + m[0].length;
  }
  if (last < text.length) parts.push(<Fragment key="end">{text.slice(last)}</Fragment>);
  return <>{parts}</>;
}
