/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  // No X-Powered-By header; the security headers are set in proxy.ts.
  poweredByHeader: false,
  serverExternalPackages: ['@node-rs/argon2', 'pg-boss', 'postgres', 'piscina', 'smtp-server', 'nodemailer'],
  typedRoutes: false,
  // API answers (not passed through proxy.ts, so request bodies stream untouched).
  async headers() {
    return [
      {
        source: '/api/:path*',
        headers: [
          { key: 'X-Content-Type-Options', value: 'nosniff' },
          { key: 'Referrer-Policy', value: 'strict-origin-when-cross-origin' },
          { key: 'X-Frame-Options', value: 'DENY' },
          { key: 'Content-Security-Policy', value: "default-src 'none'; frame-ancestors 'none'" },
        ],
      },
    ];
  },
};

export default nextConfig;
