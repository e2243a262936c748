/** @type {import('next').NextConfig} */
const nextConfig = {
  // Sequelize and the mariadb driver load optional modules dynamically; they must stay Node packages.
  serverExternalPackages: ["sequelize", "mariadb", "piscina"],
  poweredByHeader: false,
  // Lets several test runs build side by side on one machine (default ".next").
  distDir: process.env.CAIRN_DIST_DIR || ".next",
  // Type errors fail the build (and `npm test` also runs `tsc --noEmit` over tests and scripts).
};

export default nextConfig;
