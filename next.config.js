// @ts-check
// The content security policy (with a per-request script nonce) and HSTS are set in
// proxy.ts (app/_lib/proxy-rules.ts); the headers here are the same for every answer.
// Permissions-Policy: the desk needs no device or sensor, so none may be asked for.
const permissionsPolicy = [
  "camera=()",
  "microphone=()",
  "geolocation=()",
  "payment=()",
  "usb=()",
  "serial=()",
  "hid=()",
  "magnetometer=()",
  "gyroscope=()",
  "accelerometer=()",
  "display-capture=()",
].join(", ");

/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  // A second build folder lets a developer build while another server runs from .next.
  distDir: process.env.NEXT_DIST_DIR ?? ".next",
  poweredByHeader: false,
  // next start gzips every answer the client accepts compressed, route handlers included
  // (the calculate API's plot-sized answer is bounded compressed); said here so it stays on.
  compress: true,
  // Packages with Node-only code stay external to the server bundle.
  serverExternalPackages: ["pg", "bcryptjs", "nodemailer", "exceljs", "smtp-server", "mailparser", "pdfjs-dist", "pdfkit", "@resvg/resvg-js"],
  async headers() {
    return [
      {
        source: "/:path*",
        headers: [
          { key: "Permissions-Policy", value: permissionsPolicy },
          { key: "X-Content-Type-Options", value: "nosniff" },
          { key: "Referrer-Policy", value: "strict-origin-when-cross-origin" },
          { key: "X-Frame-Options", value: "DENY" },
        ],
      },
    ];
  },
};

export default nextConfig;
