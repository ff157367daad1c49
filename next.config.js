// @ts-check
const isDev = process.env.NODE_ENV !== "production";

// Content security policy: only our own origin; no eval in production (React's
// development build needs it, so only `next dev` gets it). Next inlines its
// bootstrap scripts and the charts set inline styles, hence 'unsafe-inline'.
const csp = [
  "default-src 'self'",
  `script-src 'self' 'unsafe-inline'${isDev ? " 'unsafe-eval'" : ""}`,
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "font-src 'self'",
  "connect-src 'self'",
  "object-src 'none'",
  "base-uri 'self'",
  "form-action 'self'",
  "frame-ancestors 'none'",
].join("; ");

/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  // A second build folder lets a developer build while another server runs from .next.
  distDir: process.env.NEXT_DIST_DIR ?? ".next",
  poweredByHeader: false,
  // Packages with Node-only code stay external to the server bundle.
  serverExternalPackages: ["pg", "bcryptjs", "nodemailer", "exceljs", "smtp-server", "mailparser", "pdfkit", "@resvg/resvg-js"],
  async headers() {
    return [
      {
        source: "/:path*",
        headers: [
          { key: "Content-Security-Policy", value: csp },
          { key: "X-Content-Type-Options", value: "nosniff" },
          { key: "Referrer-Policy", value: "strict-origin-when-cross-origin" },
          { key: "X-Frame-Options", value: "DENY" },
        ],
      },
    ];
  },
};

export default nextConfig;
