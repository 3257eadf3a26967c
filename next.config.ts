import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  poweredByHeader: false,
  serverExternalPackages: ["libsql", "bcryptjs", "smtp-server", "mailparser", "nodemailer", "pdfkit"],
  experimental: { authInterrupts: true },
};

export default nextConfig;
