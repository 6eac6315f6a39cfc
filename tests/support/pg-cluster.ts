import { execFileSync, execSync } from "node:child_process";
import { chownSync, existsSync, mkdtempSync, readdirSync, rmSync } from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";

// A throwaway PostgreSQL cluster in a temp dir on a free port, so tests run beside `npm start`.
const isRoot = process.getuid?.() === 0;

function pgBin(): string {
  const base = "/usr/lib/postgresql";
  const versions = existsSync(base) ? readdirSync(base).sort((a, b) => Number(b) - Number(a)) : [];
  const v = versions.find((x) => existsSync(path.join(base, x, "bin", "initdb")));
  if (!v) throw new Error("PostgreSQL is not installed (apt-get install postgresql)");
  return path.join(base, v, "bin");
}

function asOwner(cmd: string): string {
  return isRoot
    ? execFileSync("su", ["postgres", "-s", "/bin/sh", "-c", cmd], { encoding: "utf8" })
    : execSync(cmd, { encoding: "utf8", shell: "/bin/sh" });
}

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.on("error", reject);
    s.listen(0, "127.0.0.1", () => {
      const port = (s.address() as net.AddressInfo).port;
      s.close(() => resolve(port));
    });
  });
}

export interface Cluster {
  url: string;
  stop(): void;
}

export async function startCluster(): Promise<Cluster> {
  const bin = pgBin();
  const dir = mkdtempSync(path.join(os.tmpdir(), "assay-pg-"));
  if (isRoot) chownSync(dir, Number(execSync("id -u postgres").toString()), Number(execSync("id -g postgres").toString()));
  const port = await freePort();
  asOwner(`'${bin}/initdb' -D '${dir}' -U postgres -A trust -E UTF8 --no-locale >/dev/null`);
  asOwner(
    `'${bin}/pg_ctl' -D '${dir}' -l '${dir}/server.log' -o "-p ${port} -c listen_addresses=127.0.0.1 -k '${dir}' -c fsync=off -c synchronous_commit=off -c full_page_writes=off" -w -t 60 start >/dev/null`,
  );
  asOwner(`'${bin}/createdb' -h 127.0.0.1 -p ${port} -U postgres assay`);
  return {
    url: `postgresql://postgres@127.0.0.1:${port}/assay`,
    stop() {
      try {
        asOwner(`'${bin}/pg_ctl' -D '${dir}' -m immediate -w stop >/dev/null`);
      } finally {
        rmSync(dir, { recursive: true, force: true });
      }
    },
  };
}
