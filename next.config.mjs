/** @type {import('next').NextConfig} */
const nextConfig = {
  serverExternalPackages: ["handlebars", "shiki", "pg", "nodemailer"],
  poweredByHeader: false,
  outputFileTracingIncludes: { "/**": ["./templates/**/*"] },
};

export default nextConfig;
