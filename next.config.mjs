/** @type {import('next').NextConfig} */
const nextConfig = {
  // Sequelize resolves optional dialect packages at run time; bundling it breaks the build.
  serverExternalPackages: ['sequelize', 'mariadb', 'nodemailer', 'bcryptjs'],
  poweredByHeader: false,
  typescript: { ignoreBuildErrors: false },
  experimental: { turbopackFileSystemCacheForBuild: false },
};
export default nextConfig;
