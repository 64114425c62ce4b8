/** @type {import('next').NextConfig} */
const nextConfig = {
  // A second build folder lets a development server run beside a production build.
  distDir: process.env.SAGLINE_DIST_DIR || ".next",
  reactStrictMode: true,
  poweredByHeader: false,
  // pg and bcryptjs run on the server only; keep them out of the bundler.
  serverExternalPackages: ["pg", "bcryptjs"],
  // `npm run typecheck` checks the whole project (scripts and tests too); the
  // build does not repeat it.
  typescript: { ignoreBuildErrors: true },
  // No page may be framed by another site (clickjacking), content types are
  // taken as sent, and addresses do not leak to other sites in Referer.
  async headers() {
    return [
      {
        source: "/:path*",
        headers: [
          { key: "Content-Security-Policy", value: "frame-ancestors 'none'; base-uri 'self'; form-action 'self'; object-src 'none'" },
          { key: "X-Frame-Options", value: "DENY" },
          { key: "X-Content-Type-Options", value: "nosniff" },
          { key: "Referrer-Policy", value: "strict-origin-when-cross-origin" },
          { key: "Permissions-Policy", value: "camera=(), microphone=(), geolocation=(), payment=(), usb=()" },
        ],
      },
    ];
  },
};

export default nextConfig;
