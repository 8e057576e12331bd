/// Only same-origin paths may be a post-sign-in destination (no open redirect). The value is
/// parsed as a URL the way a browser would (WHATWG URL: tabs and newlines are dropped,
/// backslashes count as slashes), so "/\t/evil.example", "//evil.example" and "/\evil.example"
/// all resolve to another host and are refused; what passes is returned re-serialised as
/// path, query and fragment, so the browser cannot read it differently.
const PROBE = "http://ringside.invalid";

export function safeCallback(value: string | string[] | undefined | null): string {
  const v = Array.isArray(value) ? value[0] : value;
  if (typeof v !== "string" || !v.startsWith("/")) return "/";
  let url: URL;
  try {
    url = new URL(v, PROBE);
  } catch {
    return "/";
  }
  if (url.origin !== PROBE) return "/";
  return `${url.pathname}${url.search}${url.hash}`;
}
