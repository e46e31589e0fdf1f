/**
 * Security headers on every answer (pages, API routes, static files); tests/api/hardening/headers.test.ts
 * checks them and tests/e2e/csp.test.ts runs the editor, its picture export and the motion charts under
 * the policy. Why each source is allowed:
 *  - script-src 'unsafe-inline': Next writes the page's data into inline <script> tags; a nonce instead
 *    would need a per-request proxy and make every page dynamic. No 'unsafe-eval', no other origin.
 *  - style-src 'unsafe-inline': React Flow and the charts place things with inline styles.
 *  - img-src data: blob:: the picture export draws the canvas through an SVG data: image.
 *  - font-src data:: the picture export embeds the local font as data:.
 * Strict-Transport-Security is sent only when the request came over https through a proxy that says so
 * (X-Forwarded-Proto: https); a browser ignores it over plain http anyway (README, "Behind a proxy").
 */
const CSP = [
  "default-src 'self'",
  "script-src 'self' 'unsafe-inline'",
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "font-src 'self' data:",
  "connect-src 'self'",
  "object-src 'none'",
  "base-uri 'self'",
  "form-action 'self'",
  "frame-ancestors 'none'",
].join("; ");

const SECURITY_HEADERS = [
  { key: "Content-Security-Policy", value: CSP },
  { key: "X-Content-Type-Options", value: "nosniff" },
  { key: "Referrer-Policy", value: "strict-origin-when-cross-origin" },
  { key: "X-Frame-Options", value: "DENY" },
  { key: "Cross-Origin-Opener-Policy", value: "same-origin" },
  // Builders photograph their joints with the phone's camera from the page; nothing else is asked for.
  { key: "Permissions-Policy", value: "camera=(self), microphone=(), geolocation=(), payment=(), usb=()" },
];

/** @type {import('next').NextConfig} */
const nextConfig = {
  // A separate output folder lets tests build beside a running dev server.
  distDir: process.env.NEXT_DIST_DIR || ".next",
  serverExternalPackages: ["knex", "pg", "pg-boss", "sharp", "nodemailer", "pdf-lib"],
  poweredByHeader: false,
  typedRoutes: false,
  async headers() {
    return [
      { source: "/:path*", headers: SECURITY_HEADERS },
      {
        source: "/:path*",
        has: [{ type: "header", key: "x-forwarded-proto", value: "https" }],
        headers: [{ key: "Strict-Transport-Security", value: "max-age=31536000; includeSubDomains" }],
      },
    ];
  },
};
export default nextConfig;
