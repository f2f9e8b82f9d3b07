import type { NextConfig } from "next";
import { COMMON_SECURITY_HEADERS } from "./lib/net/security-headers";

// The test run builds into its own folder so it never clobbers the build that `npm start` serves.
const distDir = process.env.NEXT_DIST_DIR || ".next";

const nextConfig: NextConfig = {
  distDir,
  serverExternalPackages: ["pg", "pdfkit"],
  poweredByHeader: false,
  compress: false,
  typescript: { tsconfigPath: "tsconfig.json" },
  // Shared links open without signing in: keep them out of search engines and out of shared caches.
  async headers() {
    return [
      { source: "/:path*", headers: COMMON_SECURITY_HEADERS },
      { source: "/shared/:path*", headers: [{ key: "X-Robots-Tag", value: "noindex, nofollow" }, { key: "Referrer-Policy", value: "no-referrer" }, { key: "Cache-Control", value: "private, no-store" }] },
    ];
  },
};

export default nextConfig;
