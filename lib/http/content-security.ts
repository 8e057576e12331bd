/// The Content-Security-Policy of Ringside's answers. Pages get a fresh nonce per request
/// (proxy.ts): Next.js puts that nonce on its own bootstrap scripts, 'strict-dynamic' lets
/// the scripts they load run, and no other script — injected markup included — runs.
/// Styles stay 'unsafe-inline': KaTeX sets sizes in `style` attributes and CodeMirror
/// injects <style> elements. Fonts, images and connections come from this origin only;
/// nothing may frame a page. Answers that are not pages (API JSON, static files) get the
/// same policy without a nonce, where no script can run at all.

const dev = process.env.NODE_ENV === "development";

export function contentSecurityPolicy(nonce: string | null): string {
  const scripts = nonce ? `'self' 'nonce-${nonce}' 'strict-dynamic'` : "'self'";
  return [
    "default-src 'self'",
    `script-src ${scripts}${dev ? " 'unsafe-eval'" : ""}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self' data:",
    `connect-src 'self'${dev ? " ws:" : ""}`,
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join("; ");
}

/// 128 random bits, base64: unguessable, and new for every page view.
export function newNonce(): string {
  const bytes = new Uint8Array(16);
  crypto.getRandomValues(bytes);
  return btoa(String.fromCharCode(...bytes));
}
