import pg from "pg";
import { databaseUrl } from "../lib/db/database-url";

const client = new pg.Client({ connectionString: databaseUrl(), connectionTimeoutMillis: 5000 });
client
  .connect()
  .then(() => client.query("select 1"))
  .then(() => client.end())
  .catch((err: Error) => {
    console.error(`[assay] cannot reach the database: ${err.message}`);
    process.exit(1);
  });
