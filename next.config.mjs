/** @type {import('next').NextConfig} */
const nextConfig = {
  poweredByHeader: false,
  // The tests build into their own folder so that they never clobber a running `npm start`.
  distDir: process.env.KEELSON_DIST_DIR ?? ".next",
  reactStrictMode: true,
  // pg and pg-boss are server-side packages that must not be bundled.
  serverExternalPackages: ["pg", "pg-boss"],
  typedRoutes: false,
};

export default nextConfig;
