import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  serverExternalPackages: ["pg", "psychrolib", "pdfkit"],
  poweredByHeader: false,
  devIndicators: false,
  typedRoutes: false,
};

export default nextConfig;
