import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  // Sequelize loads its dialect dynamically; bundling it breaks that lookup.
  serverExternalPackages: [
    "sequelize",
    "pg",
    "pg-hstore",
    "pg-boss",
    "iron-session",
    "nodemailer",
    "geomagnetism",
    "@aws-sdk/client-s3",
    "@aws-sdk/s3-request-presigner",
  ],
  poweredByHeader: false,
  reactStrictMode: true,
  typedRoutes: false,
  experimental: { authInterrupts: true },
  // The test command builds into its own folder so it never disturbs a running `npm start`.
  distDir: process.env.NEXT_DIST_DIR ?? ".next",
  // `npm test` runs tsc over the whole tree first; the build need not repeat it.
  typescript: { ignoreBuildErrors: true },
};

export default nextConfig;
