const isDev = process.env.NODE_ENV !== "production";

// Same-origin everything; inline scripts and styles are needed by Next's
// hydration and by the chart library; eval only in development.
const csp = [
  "default-src 'self'",
  `script-src 'self' 'unsafe-inline'${isDev ? " 'unsafe-eval'" : ""}`,
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "font-src 'self' data:",
  `connect-src 'self'${isDev ? " ws: wss:" : ""}`,
  "frame-ancestors 'none'",
  "base-uri 'self'",
  "form-action 'self'",
  "object-src 'none'",
].join("; ");

const securityHeaders = [
  { key: "Content-Security-Policy", value: csp },
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
