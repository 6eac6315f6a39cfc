import type { NextConfig } from "next";

const nextConfig: NextConfig = {
  // ngspice, pg-boss and MikroORM load native or dynamic modules: keep them out of the bundle.
  serverExternalPackages: [
    "@mikro-orm/core",
    "@mikro-orm/postgresql",
    "@mikro-orm/knex",
    "@mikro-orm/migrations",
    "pg-boss",
    "mathjs",
    "smtp-server",
    "mailparser",
    "nodemailer",
  ],
  poweredByHeader: false,
  // Types are checked once, by `npm run typecheck` in npm test, so a start never fails on a type error.
  typescript: { ignoreBuildErrors: true },
  typedRoutes: false,
  // The import form sends a block file and schematic images (each at most 1 MiB) in one server action.
  experimental: { serverActions: { bodySizeLimit: "4mb" } },
};

export default nextConfig;
