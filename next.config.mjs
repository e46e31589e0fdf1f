/** @type {import('next').NextConfig} */
const nextConfig = {
  // A separate output folder lets tests build beside a running dev server.
  distDir: process.env.NEXT_DIST_DIR || ".next",
  serverExternalPackages: ["knex", "pg", "pg-boss", "sharp", "nodemailer", "pdf-lib"],
  poweredByHeader: false,
  typedRoutes: false,
};
export default nextConfig;
