/** @type {import('next').NextConfig} */
const nextConfig = {
  // Sequelize and the mariadb driver load optional modules dynamically; they must stay Node packages.
  serverExternalPackages: ["sequelize", "mariadb", "piscina"],
  poweredByHeader: false,
  // Lets several test runs build side by side on one machine (default ".next").
  distDir: process.env.CAIRN_DIST_DIR || ".next",
  // Type errors fail the build (and `npm test` also runs `tsc --noEmit` over tests and scripts).
  // forbidden() (HTTP 403 with app/forbidden.tsx) for a member whose standing refuses a page.
  experimental: { authInterrupts: true },
  // Static files too: no MIME sniffing, no framing (pages get their CSP with a nonce from proxy.ts).
  async headers() {
    return [
      {
        source: "/:path*",
        headers: [
          { key: "X-Content-Type-Options", value: "nosniff" },
          { key: "X-Frame-Options", value: "DENY" },
          { key: "Referrer-Policy", value: "same-origin" },
        ],
      },
    ];
  },
};

export default nextConfig;
