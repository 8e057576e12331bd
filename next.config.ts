import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  // The engine runs in worker threads and the server talks to PostgreSQL directly:
  // keep these packages out of the server bundle.
  serverExternalPackages: ["postgres", "pg-boss", "nodemailer", "smtp-server", "bcryptjs", "esbuild"],
  poweredByHeader: false,
  reactStrictMode: true,
};

export default nextConfig;
