/**
 * The pages' Content-Security-Policy. Next.js's bootstrapping scripts and
 * style attributes are inline ('unsafe-inline'; nonces would make every page
 * dynamic); maplibre runs its worker from a blob: or Sagline's own URL and
 * draws from data:/blob: images. A basemap named by
 * NEXT_PUBLIC_SAGLINE_BASEMAP_STYLE, and any tile hosts listed in
 * SAGLINE_CSP_MAP_SOURCES (space-separated origins), may be fetched. The
 * development server also needs eval and its reload socket.
 */
function contentSecurityPolicy() {
  const dev = process.env.NODE_ENV !== "production";
  const map = [process.env.NEXT_PUBLIC_SAGLINE_BASEMAP_STYLE && new URL(process.env.NEXT_PUBLIC_SAGLINE_BASEMAP_STYLE).origin, ...(process.env.SAGLINE_CSP_MAP_SOURCES ?? "").split(/\s+/)].filter(Boolean);
  return [
    "default-src 'self'",
    `script-src 'self' 'unsafe-inline'${dev ? " 'unsafe-eval'" : ""}`,
    "style-src 'self' 'unsafe-inline'",
    ["img-src 'self' data: blob:", ...map].join(" "),
    "font-src 'self' data:",
    ["connect-src 'self' blob: data:", ...map, ...(dev ? ["ws:"] : [])].join(" "),
    "worker-src 'self' blob:",
    "child-src 'self' blob:",
    "frame-src 'none'",
    "frame-ancestors 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "object-src 'none'",
  ].join("; ");
}

import { fileURLToPath } from "node:url";

/** @type {import('next').NextConfig} */
const nextConfig = {
  // A second build folder lets a development server run beside a production build.
  distDir: process.env.SAGLINE_DIST_DIR || ".next",
  reactStrictMode: true,
  // Stored pages (the published plans' public pages) are checked against the database
  // before they are served (lib/cache/next-cache-handler.cjs).
  cacheHandler: fileURLToPath(new URL("./lib/cache/next-cache-handler.cjs", import.meta.url)),
  // A stored page is sent with `s-maxage` = its revalidate time and no stale-while-revalidate
  // allowance, so a shared cache (a CDN) keeps a published page no longer than that.
  expireTime: 300,
  poweredByHeader: false,
  // pg and bcryptjs run on the server only; keep them out of the bundler.
  serverExternalPackages: ["pg", "bcryptjs"],
  // `npm run typecheck` checks the whole project (scripts and tests too); the
  // build does not repeat it.
  typescript: { ignoreBuildErrors: true },
  // No page may be framed by another site (clickjacking), content types are
  // taken as sent, addresses do not leak to other sites in Referer, and pages
  // load code, styles and data from Sagline alone (contentSecurityPolicy).
  async headers() {
    return [
      {
        source: "/:path*",
        headers: [
          { key: "Content-Security-Policy", value: contentSecurityPolicy() },
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
