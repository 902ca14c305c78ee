import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  // PGlite must load from node_modules at run time (its WASM and data files resolve by path).
  serverExternalPackages: ["@electric-sql/pglite"],
  // Lets several checkouts or agents build side by side without clobbering one .next.
  distDir: process.env.NEXT_DIST_DIR || ".next",
  poweredByHeader: false,
  typedRoutes: false,
};

export default nextConfig;
