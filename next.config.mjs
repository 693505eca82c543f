// The content security policy is set per request in proxy.ts (a fresh script
// nonce for every page; lib/api/csp.ts).
const securityHeaders = [
  { key: "X-Content-Type-Options", value: "nosniff" },
  { key: "X-Frame-Options", value: "DENY" },
  { key: "Referrer-Policy", value: "same-origin" },
  { key: "Permissions-Policy", value: "camera=(), microphone=(), geolocation=()" },
];

// The framework buffers a request body for proxy.ts up to proxyClientMaxBodySize
// (10 MB by default) and cuts the rest. The capture upload is outside the
// proxy's matcher; this bound keeps any other large body whole up to the limit.
const CAPTURE_MAX_BYTES = Number(process.env.CAPTURE_MAX_BYTES ?? 64 * 1024 * 1024);

/** @type {import('next').NextConfig} */
const nextConfig = {
  // Separate build folders let several local servers run side by side (scripts/serve-dev.sh).
  distDir: process.env.NEXT_DIST_DIR ?? ".next",
  serverExternalPackages: ["handlebars", "shiki", "pg", "nodemailer", "pg-boss"],
  poweredByHeader: false,
  experimental: { proxyClientMaxBodySize: CAPTURE_MAX_BYTES + 1024 * 1024 },
  // Local servers are reached as 127.0.0.1 as well as localhost.
  allowedDevOrigins: ["127.0.0.1"],
  // `npm test` type-checks the whole tree (tsc --noEmit) before it builds.
  typescript: { ignoreBuildErrors: true },
  outputFileTracingIncludes: { "/**": ["./templates/**/*"] },
  async headers() {
    return [{ source: "/:path*", headers: securityHeaders }];
  },
};

export default nextConfig;
