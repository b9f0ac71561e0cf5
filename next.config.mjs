/** @type {import('next').NextConfig} */
const nextConfig = {
  // Sequelize resolves optional dialect packages at run time; bundling it breaks the build.
  serverExternalPackages: ['sequelize', 'mariadb', 'nodemailer', 'bcryptjs', 'piscina', 'tsx'],
  poweredByHeader: false,
  typescript: { ignoreBuildErrors: false },
  experimental: { turbopackFileSystemCacheForBuild: false },
  // Security headers on every answer. Everything is served from the app itself (fonts, KaTeX, the
  // Monaco editor and its workers); Next.js's hydration needs inline scripts, KaTeX and Monaco inline styles.
  // object-src 'self': evidence documents (PDF) shown inline from /api/attachments.
  // 'unsafe-eval' is there because ajv compiles the check-case schema in the browser (the author's CSV
  // preview); precompiling it with ajv's standalone code would let the policy drop it.
  async headers() {
    const dev = process.env.NODE_ENV === 'development';
    const csp = [
      "default-src 'self'", "script-src 'self' 'unsafe-inline' 'unsafe-eval'", "style-src 'self' 'unsafe-inline'",
      "img-src 'self' data: blob:", "font-src 'self' data:", `connect-src 'self'${dev ? ' ws:' : ''}`, "worker-src 'self' blob:",
      "frame-ancestors 'none'", "base-uri 'self'", "form-action 'self'", "object-src 'self'",
    ].join('; ');
    return [{
      source: '/:path*',
      headers: [
        { key: 'Content-Security-Policy', value: csp },
        { key: 'X-Frame-Options', value: 'DENY' },
        { key: 'X-Content-Type-Options', value: 'nosniff' },
        { key: 'Referrer-Policy', value: 'same-origin' },
        { key: 'Permissions-Policy', value: 'camera=(), microphone=(), geolocation=()' },
      ],
    }, {
      // Evidence documents open inline beside their check case (an <object> on the app's own pages): framing by the
      // app itself only; the document may load nothing (an image shows itself, a PDF its own viewer).
      source: '/api/attachments/:id',
      headers: [
        { key: 'Content-Security-Policy', value: "default-src 'none'; img-src 'self'; style-src 'unsafe-inline'; frame-ancestors 'self'" },
        { key: 'X-Frame-Options', value: 'SAMEORIGIN' },
      ],
    }];
  },
};
export default nextConfig;
