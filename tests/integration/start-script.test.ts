import { spawnSync } from "node:child_process";
import net from "node:net";
import { describe, expect, it } from "vitest";

// npm start must fail with one clear line, not a stack trace, for the two mistakes people make most.
function runStart(env: Record<string, string>) {
  return spawnSync("bash", ["scripts/start.sh"], {
    env: { ...process.env, ...env },
    encoding: "utf8",
    timeout: 120_000,
  });
}

describe("npm start on bad input", () => {
  it("says the database is unreachable", () => {
    const r = runStart({ DATABASE_URL: "postgresql://postgres@127.0.0.1:9/assay" });
    expect(r.status).not.toBe(0);
    expect(r.stderr).toMatch(/database .* is not reachable|cannot reach the database/);
    expect(r.stderr).not.toMatch(/\n\s+at /);
  });

  it("names the web port that is already in use", async () => {
    const blocker = net.createServer();
    await new Promise<void>((resolve) => blocker.listen(0, "127.0.0.1", resolve));
    const port = (blocker.address() as net.AddressInfo).port;
    try {
      const r = runStart({ DATABASE_URL: process.env.DATABASE_URL!, PORT: String(port) });
      expect(r.status).not.toBe(0);
      expect(r.stderr).toContain(`port ${port} is already in use`);
    } finally {
      blocker.close();
    }
  });
});
