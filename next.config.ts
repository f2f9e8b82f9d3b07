import type { NextConfig } from "next";

// The test run builds into its own folder so it never clobbers the build that `npm start` serves.
const distDir = process.env.NEXT_DIST_DIR || ".next";

const nextConfig: NextConfig = {
  distDir,
  serverExternalPackages: ["pg"],
  poweredByHeader: false,
  compress: false,
  typescript: { tsconfigPath: "tsconfig.json" },
};

export default nextConfig;
