// One place decides where the database is: DATABASE_URL, else our own cluster on loopback.
export function databaseUrl(): string {
  if (process.env.DATABASE_URL) return process.env.DATABASE_URL;
  const port = process.env.ASSAY_DB_PORT ?? "54329";
  return `postgresql://postgres@127.0.0.1:${port}/assay`;
}
