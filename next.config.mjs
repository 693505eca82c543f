// The content security policy is set per request in proxy.ts (a fresh script
// nonce for every page; lib/api/csp.ts).
const securityHeaders = [
  { key: "X-Content-Type-Options", value: "nosniff" },
  { key: "X-Frame-Options", value: "DENY" },
  { key: "Referrer-Policy", value: "same-origin" },
  { key: "Permissions-Policy", value: "camera=(), microphone=(), geolocation=()" },
];

/** @type {import('next').NextConfig} */
const nextConfig = {
  // Separate build folders let several local servers run side by side (scripts/serve-dev.sh).
  distDir: process.env.NEXT_DIST_DIR ?? ".next",
  serverExternalPackages: ["handlebars", "shiki", "pg", "nodemailer", "pg-boss"],
  poweredByHeader: false,
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
