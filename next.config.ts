import type { NextConfig } from "next";

const securityHeaders = [
  { key: "X-Content-Type-Options", value: "nosniff" },
  { key: "Referrer-Policy", value: "strict-origin-when-cross-origin" },
  { key: "X-Frame-Options", value: "DENY" },
  { key: "Permissions-Policy", value: "camera=(), microphone=(), geolocation=()" },
];

const nextConfig: NextConfig = {
  // Several working copies (or test runs) can build side by side into their own folders.
  distDir: process.env.VICINAL_DIST_DIR ?? ".next",
  output: process.env.VICINAL_STANDALONE === "1" ? "standalone" : undefined,
  poweredByHeader: false,
  // `npm test` type-checks the whole tree once (tsc) before building; this skips the second pass inside `next build`.
  typescript: { ignoreBuildErrors: process.env.VICINAL_SKIP_BUILD_TYPECHECK === "1" },
  serverExternalPackages: ["hnswlib-node", "@node-rs/argon2", "pg-boss", "sharp", "pg-copy-streams", "rate-limiter-flexible"],
  async headers() {
    return [
      { source: "/:path*", headers: securityHeaders },
      { source: "/api/:path*", headers: [{ key: "Content-Security-Policy", value: "default-src 'none'; frame-ancestors 'none'" }, { key: "Cache-Control", value: "no-store" }] },
    ];
  },
};

export default nextConfig;
