import type { NextConfig } from "next";

/// Content-Security-Policy for every answer. KaTeX and CodeMirror need inline styles
/// (KaTeX sets sizes in `style` attributes, CodeMirror injects <style> elements); fonts and
/// scripts come from this origin only. Next.js's App Router puts its bootstrap data in
/// inline <script> tags, so scripts also allow 'unsafe-inline' (a nonce would force every
/// page to render per request); no origin other than ours may run or load anything, and
/// `next dev` alone gets 'unsafe-eval' for its hot reloader.
const dev = process.env.NODE_ENV === "development";
const CONTENT_SECURITY_POLICY = [
  "default-src 'self'",
  `script-src 'self' 'unsafe-inline'${dev ? " 'unsafe-eval'" : ""}`,
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "font-src 'self' data:",
  `connect-src 'self'${dev ? " ws:" : ""}`,
  "object-src 'none'",
  "base-uri 'self'",
  "form-action 'self'",
  "frame-ancestors 'none'",
].join("; ");

const SECURITY_HEADERS = [
  { key: "Content-Security-Policy", value: CONTENT_SECURITY_POLICY },
  { key: "X-Content-Type-Options", value: "nosniff" },
  { key: "Referrer-Policy", value: "same-origin" },
  // For browsers without frame-ancestors support.
  { key: "X-Frame-Options", value: "DENY" },
  { key: "Cross-Origin-Opener-Policy", value: "same-origin" },
];

const nextConfig: NextConfig = {
  // The engine runs in worker threads and the server talks to PostgreSQL directly:
  // keep these packages out of the server bundle.
  serverExternalPackages: ["postgres", "pg-boss", "nodemailer", "smtp-server", "bcryptjs", "esbuild"],
  poweredByHeader: false,
  reactStrictMode: true,
  async headers() {
    return [{ source: "/:path*", headers: SECURITY_HEADERS }];
  },
};

export default nextConfig;
