/** @type {import('next').NextConfig} */

// Screens get their Content-Security-Policy with a per-response script nonce from proxy.ts
// (lib/platform/http/content-security.ts); API answers get one that allows nothing.
const apiCsp = "default-src 'none'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'";

const securityHeaders = [
  { key: "X-Frame-Options", value: "DENY" },
  { key: "X-Content-Type-Options", value: "nosniff" },
  { key: "Referrer-Policy", value: "same-origin" },
  { key: "Permissions-Policy", value: "camera=(), microphone=(), geolocation=()" },
];

const nextConfig = {
  distDir: process.env.NEXT_DIST_DIR || ".next",
  poweredByHeader: false,
  // Browser source maps only when asked (the editor benchmark's profile reads them back to the
  // sources); a normal build does not publish the sources.
  productionBrowserSourceMaps: process.env.LOOPKEEPER_BROWSER_SOURCEMAPS === "1",
  reactStrictMode: true,
  serverExternalPackages: ["pino", "pg", "bcryptjs", "nodemailer", "smtp-server", "@aws-sdk/client-s3"],
  experimental: { authInterrupts: true },
  async headers() {
    return [
      { source: "/:path*", headers: securityHeaders },
      { source: "/api/:path*", headers: [{ key: "Content-Security-Policy", value: apiCsp }] },
    ];
  },
};

export default nextConfig;
