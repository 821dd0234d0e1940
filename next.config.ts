import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  reactStrictMode: true,
  poweredByHeader: false,
  // Server-only packages with native or Node-specific code stay out of the bundle.
  serverExternalPackages: ["pg-boss", "nodemailer", "smtp-server", "postgres"],
};

export default nextConfig;
