import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  // The worker and the scripts run the same lib/ code outside Next; these packages must stay
  // plain Node modules rather than be bundled.
  serverExternalPackages: ["pg", "pg-boss", "nodemailer"],
  // `npm test` runs tsc and eslint itself; doing it again inside the build only costs time.
  typescript: { ignoreBuildErrors: true },
  poweredByHeader: false,
  // forbidden() renders app/forbidden.tsx with status 403 for a role without access.
  experimental: { authInterrupts: true },
  async headers() {
    return [
      {
        source: "/:path*",
        headers: [
          { key: "X-Content-Type-Options", value: "nosniff" },
          { key: "Referrer-Policy", value: "same-origin" },
          { key: "X-Frame-Options", value: "SAMEORIGIN" },
        ],
      },
    ];
  },
};

export default nextConfig;
