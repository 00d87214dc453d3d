const isDev = process.env.NODE_ENV !== 'production';

// Next's inline bootstrap scripts need 'unsafe-inline' without per-request nonces (see DEVELOPERS.md, known gaps).
const contentSecurityPolicy = [
  "default-src 'self'",
  `script-src 'self' 'unsafe-inline'${isDev ? " 'unsafe-eval'" : ''}`,
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "font-src 'self'",
  "connect-src 'self'",
  "object-src 'none'",
  "base-uri 'none'",
  "form-action 'self'",
  "frame-ancestors 'none'",
].join('; ');

/** @type {import('next').NextConfig} */
const nextConfig = {
  // Parallel local builds (several engineers in one checkout) each use their own output folder.
  distDir: process.env.NEXT_DIST_DIR ?? '.next',
  poweredByHeader: false,
  reactStrictMode: true,
  serverExternalPackages: ['better-sqlite3', '@node-rs/argon2', 'sharp', 'smtp-server', 'nodemailer'],
  experimental: {
    authInterrupts: true,
    serverActions: { bodySizeLimit: '1mb' },
    // proxy.ts only matches guarded pages; should it ever match uploads, bodies over this would be cut silently.
    proxyClientMaxBodySize: '16mb',
  },
  async headers() {
    return [
      {
        source: '/:path*',
        headers: [
          { key: 'Content-Security-Policy', value: contentSecurityPolicy },
          { key: 'X-Content-Type-Options', value: 'nosniff' },
          { key: 'Referrer-Policy', value: 'strict-origin-when-cross-origin' },
          { key: 'X-Frame-Options', value: 'DENY' },
          { key: 'Strict-Transport-Security', value: 'max-age=63072000; includeSubDomains' },
        ],
      },
    ];
  },
};

export default nextConfig;
