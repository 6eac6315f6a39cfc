import { createServer, type Server } from "node:http";
import { Engine } from "./engine";
import { MeiliError, errors } from "./errors";
import { authorize, readBody, send } from "./http-util";
import { route } from "./routes";
import { Store } from "./store";

export interface SearchServerOptions {
  port: number; // 0 picks a free port
  key: string; // the master key clients send as a Bearer token
  dir: string; // data directory (created if absent)
  host?: string;
}

export interface RunningSearchServer {
  url: string;
  port: number;
  close(): Promise<void>;
}

// A stand-in for the subset of Meilisearch's REST API that Assay uses.
export function startSearchServer(o: SearchServerOptions): Promise<RunningSearchServer> {
  const engine = new Engine(new Store(o.dir));
  const host = o.host ?? "127.0.0.1";
  const server: Server = createServer(async (req, res) => {
    try {
      const url = new URL(req.url ?? "/", "http://localhost");
      const path = url.pathname.split("/").filter(Boolean);
      if (path.length === 1 && path[0] === "health" && req.method === "GET") return send(res, 200, { status: "available" });
      authorize(req, o.key);
      const [status, body] = await route(engine, { method: req.method ?? "GET", path, query: url.searchParams, body: () => readBody(req) });
      send(res, status, body);
    } catch (e) {
      const err = e instanceof MeiliError ? e : errors.internal((e as Error)?.message ?? String(e));
      if (!(e instanceof MeiliError)) console.error("search server:", e);
      send(res, err.status, err.toJSON());
    }
  });
  return new Promise((resolve, reject) => {
    server.once("error", reject);
    server.listen(o.port, host, () => {
      server.off("error", reject);
      const address = server.address();
      const port = typeof address === "object" && address ? address.port : o.port;
      resolve({
        url: `http://${host}:${port}`,
        port,
        close: async () => {
          await new Promise<void>((done) => {
            server.close(() => done());
            server.closeAllConnections();
          });
          await engine.idle();
        },
      });
    });
  });
}
