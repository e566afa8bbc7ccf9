/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  serverExternalPackages: ['@node-rs/argon2', 'pg-boss', 'postgres', 'piscina', 'smtp-server', 'nodemailer'],
  typedRoutes: false,
};

export default nextConfig;
