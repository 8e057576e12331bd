import type { NextConfig } from "next";

import { contentSecurityPolicy } from "./lib/http/content-security";

// Pages get their Content-Security-Policy, with a per-request nonce, from proxy.ts; every
// other answer (API, static files) gets the same policy without one.
const SECURITY_HEADERS = [
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
    const noNonce = [{ key: "Content-Security-Policy", value: contentSecurityPolicy(null) }];
    return [
      { source: "/:path*", headers: SECURITY_HEADERS },
      { source: "/api/:path*", headers: noNonce },
      { source: "/_next/:path*", headers: noNonce },
    ];
  },
};

export default nextConfig;
