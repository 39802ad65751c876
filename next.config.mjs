/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  // pg, pg-boss and the AWS SDK are server-only and must not be bundled.
  serverExternalPackages: ["pg", "pg-boss"],
};

export default nextConfig;
