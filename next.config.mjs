/** @type {import('next').NextConfig} */
const nextConfig = {
  // Sequelize and the mariadb driver load optional modules dynamically; they must stay Node packages.
  serverExternalPackages: ["sequelize", "mariadb", "piscina"],
  poweredByHeader: false,
  // Lets several test runs build side by side on one machine (default ".next").
  distDir: process.env.CAIRN_DIST_DIR || ".next",
  // Type checking runs once, over the whole project (tests and scripts included), as `npm run typecheck`
  // inside `npm test`; the build does not repeat it.
  typescript: { ignoreBuildErrors: true },
};

export default nextConfig;
