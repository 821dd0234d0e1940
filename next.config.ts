import type { NextConfig } from "next";
import { apiContentSecurityPolicy, commonSecurityHeaders } from "./lib/server/security-headers";

const nextConfig: NextConfig = {
  // `npm test` builds into its own folder so that it never rebuilds the one a running `npm start` serves.
  distDir: process.env.NEXT_DIST_DIR ?? ".next",
  reactStrictMode: true,
  poweredByHeader: false,
  // forbidden() gives a member below a page's role a real 403 (lib/server/workspace-access.ts).
  experimental: { authInterrupts: true },
  // Server-only packages with native or Node-specific code stay out of the bundle.
  serverExternalPackages: ["pg-boss", "nodemailer", "smtp-server", "postgres"],
  // Pages get their nonce-based policy from proxy.ts.
  async headers() {
    return [
      { source: "/:path*", headers: [...commonSecurityHeaders] },
      { source: "/api/:path*", headers: [{ key: "Content-Security-Policy", value: apiContentSecurityPolicy }] },
    ];
  },
};

export default nextConfig;
