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
  typedRoutes: false,
};

export default nextConfig;
