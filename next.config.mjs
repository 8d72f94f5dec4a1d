/** @type {import('next').NextConfig} */
const nextConfig = {
  // knex pulls optional drivers (oracledb, mysql, tedious) that must not be bundled.
  serverExternalPackages: ['knex', 'pg'],
  poweredByHeader: false,
  reactStrictMode: true,
};

export default nextConfig;
