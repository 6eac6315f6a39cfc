import path from "node:path";
import { startSearchServer } from "./index";
import { ensureMasterKey } from "./key";

// `npm run search-server`: the local search server on 127.0.0.1.
// LOCAL_SEARCH_PORT [7700], LOCAL_SEARCH_DIR [var/search], MEILI_MASTER_KEY [var/search-key].
async function main() {
  const port = Number(process.env.LOCAL_SEARCH_PORT ?? 7700);
  const dir = path.resolve(process.env.LOCAL_SEARCH_DIR ?? "var/search");
  const key = ensureMasterKey(path.resolve("var"));
  try {
    const server = await startSearchServer({ port, key, dir });
    console.log(`search server listening on ${server.url}`);
    const stop = async () => {
      await server.close();
      process.exit(0);
    };
    process.on("SIGINT", stop);
    process.on("SIGTERM", stop);
  } catch (e) {
    const err = e as NodeJS.ErrnoException;
    if (err.code === "EADDRINUSE") console.error(`search server: port ${port} on 127.0.0.1 is already in use (set LOCAL_SEARCH_PORT to move it)`);
    else console.error(`search server: ${err.message}`);
    process.exit(1);
  }
}

void main();
