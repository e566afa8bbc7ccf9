/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  // No X-Powered-By header; the security headers are set in proxy.ts.
  poweredByHeader: false,
  serverExternalPackages: ['@node-rs/argon2', 'pg-boss', 'postgres', 'piscina', 'smtp-server', 'nodemailer'],
  typedRoutes: false,
};

export default nextConfig;
