import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  serverExternalPackages: ["pg", "psychrolib", "pdfkit"],
  poweredByHeader: false,
  devIndicators: false,
  typedRoutes: false,
  /** The vacuum decay test pages moved from /tests to /vacuum-tests: saved links and bookmarks land on the new page. */
  async redirects() {
    return [
      { source: "/tests", destination: "/vacuum-tests", permanent: true },
      { source: "/tests/:path*", destination: "/vacuum-tests/:path*", permanent: true },
    ];
  },
  /**
   * The API moved from /api/tests to /api/vacuum-tests; the old paths still answer (scripts and queued
   * retries keep working). A rewrite, not a redirect: a 308 on a multipart POST would make every client
   * send the log twice. The request keeps its headers, so the same-origin check of lib/api/csrf.ts and the
   * proxy's headers apply as before.
   */
  async rewrites() {
    return [
      { source: "/api/tests", destination: "/api/vacuum-tests" },
      { source: "/api/tests/:path*", destination: "/api/vacuum-tests/:path*" },
    ];
  },
};

export default nextConfig;
