/** @type {import('next').NextConfig} */

// Where clips and tracks are read from and uploaded to (presigned URLs): the S3 endpoint's origin. On a
// loopback host any port is allowed, because the test fakes listen on a free port chosen at start-up
// while the headers are fixed when the app is built.
function storageSource() {
  const endpoint = new URL(process.env.S3_ENDPOINT ?? "http://127.0.0.1:4569");
  const loopback = ["127.0.0.1", "localhost", "[::1]"].includes(endpoint.hostname);
  return loopback ? `${endpoint.protocol}//${endpoint.hostname}:*` : endpoint.origin;
}

function contentSecurityPolicy() {
  const storage = storageSource();
  const dev = process.env.NODE_ENV !== "production";
  const directives = {
    "default-src": ["'self'"],
    // Next's App Router streams its data in inline scripts (no nonce without dynamic rendering of every page);
    // 'wasm-unsafe-eval' lets tfjs compile its WebAssembly backend; `next dev` also needs eval for fast refresh.
    "script-src": ["'self'", "'unsafe-inline'", "'wasm-unsafe-eval'", ...(dev ? ["'unsafe-eval'"] : [])],
    // The analysis worker is a same-origin module script (public/workers).
    "worker-src": ["'self'"],
    "style-src": ["'self'", "'unsafe-inline'"],
    "font-src": ["'self'", "data:"],
    "img-src": ["'self'", "data:", "blob:", storage],
    "media-src": ["'self'", "blob:", storage],
    // Presigned part uploads, clip and track reads; the models and wasm come from the app itself.
    "connect-src": ["'self'", storage, ...(dev ? ["ws:"] : [])],
    "frame-ancestors": ["'none'"],
    "form-action": ["'self'"],
    "base-uri": ["'self'"],
    "object-src": ["'none'"],
  };
  return Object.entries(directives)
    .map(([name, values]) => `${name} ${values.join(" ")}`)
    .join("; ");
}

export const securityHeaders = () => [
  { key: "Content-Security-Policy", value: contentSecurityPolicy() },
  { key: "X-Frame-Options", value: "DENY" },
  { key: "Referrer-Policy", value: "strict-origin-when-cross-origin" },
  { key: "X-Content-Type-Options", value: "nosniff" },
  // The camera is for recording a set in the browser; nothing else is needed.
  { key: "Permissions-Policy", value: "camera=(self), microphone=(), geolocation=(), payment=(), usb=()" },
];

const nextConfig = {
  reactStrictMode: true,
  // Two checkouts building at once on one machine keep their builds apart with PLUMBLINE_DIST_DIR.
  distDir: process.env.PLUMBLINE_DIST_DIR ?? ".next",
  // pg, pg-boss and the AWS SDK are server-only and must not be bundled.
  serverExternalPackages: ["pg", "pg-boss"],
  poweredByHeader: false,
  async headers() {
    return [{ source: "/:path*", headers: securityHeaders() }];
  },
};

export default nextConfig;
