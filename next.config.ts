import type { NextConfig } from "next";

const dev = process.env.NODE_ENV === "development";

/**
 * The Content-Security-Policy of every page. Next's App Router writes inline scripts (the page's
 * data for hydration) and React and the charts set inline styles, so both allow 'unsafe-inline'
 * (nonces would need a proxy that buffers request bodies and every page rendered per request);
 * everything else loads from this origin only. The wizard's solver is a Web Worker served from
 * /_next/static ('self'). Fonts are files of our own (next/font/local). `next dev` also needs eval
 * for its fast refresh. frame-ancestors 'none': no other site may frame the app (clickjacking).
 */
const contentSecurityPolicy = [
  "default-src 'self'",
  `script-src 'self' 'unsafe-inline'${dev ? " 'unsafe-eval'" : ""}`,
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "font-src 'self' data:",
  `connect-src 'self'${dev ? " ws: wss:" : ""}`,
  "worker-src 'self' blob:",
  "frame-src 'self'",
  "object-src 'none'",
  "base-uri 'self'",
  "form-action 'self'",
  "frame-ancestors 'none'",
].join("; ");

const nextConfig: NextConfig = {
  // PGlite must load from node_modules at run time (its WASM and data files resolve by path).
  serverExternalPackages: ["@electric-sql/pglite"],
  // Lets several checkouts or agents build side by side without clobbering one .next.
  distDir: process.env.NEXT_DIST_DIR || ".next",
  poweredByHeader: false,
  typedRoutes: false,
  // README "Security → Requests" lists these.
  async headers() {
    return [
      {
        source: "/:path*",
        headers: [
          { key: "Content-Security-Policy", value: contentSecurityPolicy },
          { key: "X-Content-Type-Options", value: "nosniff" },
          { key: "Referrer-Policy", value: "same-origin" },
          { key: "X-Frame-Options", value: "DENY" },
        ],
      },
      {
        // API answers hold a team's data: never kept by a browser or a shared cache.
        source: "/api/:path*",
        headers: [{ key: "Cache-Control", value: "no-store" }],
      },
    ];
  },
};

export default nextConfig;
