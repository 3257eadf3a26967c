import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  poweredByHeader: false,
  serverExternalPackages: ["bcryptjs", "smtp-server", "mailparser", "nodemailer"],
};

export default nextConfig;
