/** @type {import('next').NextConfig} */
const nextConfig = {
  poweredByHeader: false,
  // The tests build into their own folder so that they never clobber a running `npm start`.
  distDir: process.env.KEELSON_DIST_DIR ?? ".next",
  reactStrictMode: true,
  // pg, pg-boss, exceljs (the import's workbooks) and pdfkit (the reports; it reads its own files at run
  // time) are server-side packages that must not be bundled.
  serverExternalPackages: ["pg", "pg-boss", "exceljs", "pdfkit"],
  typedRoutes: false,
  // The fixed security headers, on every page, route handler and static file. A page's
  // Content-Security-Policy (with its nonce) and HSTS over https are set per request in proxy.ts.
  async headers() {
    return [
      {
        source: "/:path*",
        headers: [
          { key: "X-Content-Type-Options", value: "nosniff" },
          // frame-ancestors 'none' in the policies says the same to browsers that read CSP.
          { key: "X-Frame-Options", value: "DENY" },
          // Addresses name vessels and work orders: they never leave for another site.
          { key: "Referrer-Policy", value: "same-origin" },
          // The camera only for Keelson's own pages (photos of a completed job, <input capture>).
          { key: "Permissions-Policy", value: "camera=(self), microphone=(), geolocation=(), payment=(), usb=()" },
          { key: "Cross-Origin-Opener-Policy", value: "same-origin" },
        ],
      },
      {
        // Route handlers answer data, never a page: nothing in a response runs. Next keeps a header
        // set here over a route's own, so this is the attachments' policy too (a photo opened in its
        // own tab: its image and the browser's inline styling; server/attachments/download.ts).
        source: "/api/:path*",
        headers: [
          {
            key: "Content-Security-Policy",
            value:
              "default-src 'none'; img-src 'self'; style-src 'unsafe-inline'; sandbox; frame-ancestors 'none'; base-uri 'none'; form-action 'none'",
          },
        ],
      },
    ];
  },
};

export default nextConfig;
