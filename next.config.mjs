/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  poweredByHeader: false,
  // The worker and scripts share lib/ and db/; keep server-only packages out of the client bundle.
  serverExternalPackages: ["pg", "pg-boss", "bcryptjs", "nodemailer", "mathjs", "pdfkit"],
  typedRoutes: false,
  // `npm test` type-checks the whole repository as its own step (tsc --noEmit); checking
  // again inside every build would only add time.
  typescript: { ignoreBuildErrors: true },
  experimental: {
    // proxy.ts runs before the API, so Next.js copies each request body into memory for it, up
    // to this size, and hands the route only that much. It equals MAX_BODY_BYTES in
    // lib/http/body-limits.ts (the largest body any route reads; a unit test keeps them equal):
    // larger bodies are refused anyway, and no request holds more than this in memory.
    proxyClientMaxBodySize: 4 * 1024 * 1024,
  },
  // For every response, static files included; the Content-Security-Policy is set per request
  // in proxy.ts (pages need a fresh nonce), and for Next's static files here.
  async headers() {
    const always = [
      { key: "X-Frame-Options", value: "DENY" },
      { key: "X-Content-Type-Options", value: "nosniff" },
      { key: "Referrer-Policy", value: "same-origin" },
    ];
    return [
      { source: "/:path*", headers: always },
      { source: "/_next/:path*", headers: [{ key: "Content-Security-Policy", value: "default-src 'none'; frame-ancestors 'none'" }] },
      { source: "/favicon.ico", headers: [{ key: "Content-Security-Policy", value: "default-src 'none'; frame-ancestors 'none'" }] },
    ];
  },
};

export default nextConfig;
