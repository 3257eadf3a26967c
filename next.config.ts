import type { NextConfig } from "next";
import { API_CSP, FIXED_SECURITY_HEADERS, HSTS_HEADER } from "./lib/http/security-headers";

const nextConfig: NextConfig = {
  poweredByHeader: false,
  serverExternalPackages: ["libsql", "bcryptjs", "smtp-server", "mailparser", "nodemailer", "pdfkit"],
  experimental: { authInterrupts: true },
  async headers() {
    return [
      { source: "/:path*", headers: [...FIXED_SECURITY_HEADERS] },
      { source: "/:path*", has: [{ type: "header", key: "x-forwarded-proto", value: "https" }], headers: [HSTS_HEADER] },
      // Pages get theirs, with a nonce, from proxy.ts.
      { source: "/api/:path*", headers: [{ key: "Content-Security-Policy", value: API_CSP }] },
    ];
  },
};

export default nextConfig;
