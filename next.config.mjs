/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  // pg and the AWS SDK are server-only and must not be bundled.
  serverExternalPackages: ["pg"],
};

export default nextConfig;
