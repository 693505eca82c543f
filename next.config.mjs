/** @type {import('next').NextConfig} */
const nextConfig = {
  serverExternalPackages: ["handlebars", "shiki", "pg", "nodemailer"],
  poweredByHeader: false,
  // `npm test` type-checks the whole tree (tsc --noEmit) before it builds.
  typescript: { ignoreBuildErrors: true },
  outputFileTracingIncludes: { "/**": ["./templates/**/*"] },
};

export default nextConfig;
