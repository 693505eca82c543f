/** @type {import('next').NextConfig} */
const nextConfig = {
  // Separate build folders let several local servers run side by side (scripts/serve-dev.sh).
  distDir: process.env.NEXT_DIST_DIR ?? ".next",
  serverExternalPackages: ["handlebars", "shiki", "pg", "nodemailer"],
  poweredByHeader: false,
  // Local servers are reached as 127.0.0.1 as well as localhost.
  allowedDevOrigins: ["127.0.0.1"],
  // `npm test` type-checks the whole tree (tsc --noEmit) before it builds.
  typescript: { ignoreBuildErrors: true },
  outputFileTracingIncludes: { "/**": ["./templates/**/*"] },
};

export default nextConfig;
