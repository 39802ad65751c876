/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  // Two checkouts building at once on one machine keep their builds apart with PLUMBLINE_DIST_DIR.
  distDir: process.env.PLUMBLINE_DIST_DIR ?? ".next",
  // pg, pg-boss and the AWS SDK are server-only and must not be bundled.
  serverExternalPackages: ["pg", "pg-boss"],
};

export default nextConfig;
