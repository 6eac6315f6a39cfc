import { execFileSync, spawn } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { localExecutor, type SimOutcome } from "@/checks";
import { runBatchAsync } from "@/checks/spice/batch";
import { parseRawFile } from "@/checks/spice/raw-file";
import { simRequest } from "@/checks/spice/request";
import { runNgspice } from "@/checks/spice/run-ngspice";
import { NgspiceSession } from "@/checks/spice/session";

const cacheDir = fs.mkdtempSync(path.join(os.tmpdir(), "assay-batch-"));
afterAll(() => fs.rmSync(cacheDir, { recursive: true, force: true }));

// A diode-limited Wien bridge: a transient of a few thousand points, as a Monte Carlo sample runs it.
const wien = (R: number) =>
  simRequest({
    title: "wien",
    params: { R, C: 10e-9 },
    analysis: { kind: "tran", stop: 20e-3, step: 5e-6, uic: true },
    circuit: "Rs out a {R}\nCs a p {C}\nRp p 0 {R}\nCp p 0 {C}\nRg n 0 10k\nRf1 out m 15k\nRf2 m n 5.9k\nD1 m n dd\nD2 n m dd\n.model dd D(IS=1e-14)\nE1 out 0 p n 1e5\n.ic v(p)=0.01",
  });

/** Every vector of a raw file by name (a batch's `write` lists them in another order than `-r`). */
function vectors(raw: Uint8Array): Record<string, number[]> {
  const [plot] = parseRawFile(Buffer.from(raw));
  return Object.fromEntries(plot.variables.map((v) => [v.name, [...plot.real[v.index]]]));
}

describe("transients several to one ngspice process", () => {
  it("gives each member the vectors its own `ngspice -b -r` run writes, value for value", async () => {
    const reqs = [15.8e3, 16e3, 15.6e3].map(wien);
    const raws = await runBatchAsync(reqs.map((r) => r.deck));
    for (const [i, r] of reqs.entries()) {
      expect(raws[i]).not.toBeNull();
      // ngspice itself, alone, is the reference.
      expect(vectors(raws[i]!)).toEqual(vectors(runNgspice(r.deck).raw));
    }
  });

  it("runs every member alone when one transient aborts, so the abort is an error as in a single run", async () => {
    // Positive feedback with gain 2 around an RC and no limit grows as e^{t/RC} until ngspice gives up with
    // "timestep too small", leaving a plot of a few points under the member's title.
    const runaway = simRequest({
      title: "runaway", params: {}, analysis: { kind: "tran", stop: 1e-3, step: 1e-6, uic: true },
      circuit: "E1 out 0 x 0 2\nR1 out x 1k\nC1 x 0 1n\n.ic v(x)=1",
    });
    const reqs = [wien(15.8e3), runaway, wien(16e3)];
    expect(await runBatchAsync(reqs.map((r) => r.deck))).toEqual([null, null, null]);
    // The same with a worker slot's kept process: the abort ends it, and the members run alone.
    for (const keep of [false, true]) {
      const executor = localExecutor({ cacheDir, noCache: true, concurrency: 1, keep });
      const outcomes: SimOutcome[] = await executor.runMany(reqs);
      executor.close();
      expect(outcomes.map((o) => o.ok)).toEqual([true, false, true]);
      expect(outcomes[1].ok === false && outcomes[1].error).toMatch(/timestep too small/i);
      expect(vectors((outcomes[0] as SimOutcome & { ok: true }).raw)).toEqual(vectors(runNgspice(reqs[0].deck).raw));
    }
  });
});

describe("options that outlive their circuit in one ngspice process", () => {
  // ngspice 39 keeps `.options interp` and `.options cshunt` in force for every later circuit of the same process
  // (seen with Debian's ngspice: `remcirc` and `unset` leave them). A neighbour in a batch must not change a plot.
  for (const option of ["interp", "cshunt=1e-12"]) {
    it(`a circuit with .options ${option} leaves the next member's plot as its own run gives it`, async () => {
      const withOption = simRequest({
        title: "with option", params: { R: 15.8e3, C: 10e-9 }, analysis: { kind: "tran", stop: 20e-3, step: 5e-6, uic: true },
        circuit: `${wien(15.8e3).circuit}\n.options ${option}`,
      });
      const plain = wien(16e3);
      const outcomes = await localExecutor({ cacheDir, noCache: true, concurrency: 1 }).runMany([withOption, plain]);
      expect(outcomes.every((o) => o.ok)).toBe(true);
      // ngspice alone is the reference for the plain member: same points, same values.
      expect(vectors((outcomes[1] as SimOutcome & { ok: true }).raw)).toEqual(vectors(runNgspice(plain.deck).raw));
    });
  }
});

describe("a kept ngspice process (a worker slot's session)", () => {
  it("answers batch after batch with the vectors each member's own `ngspice -b -r` run writes", async () => {
    const session = new NgspiceSession();
    try {
      for (const Rs of [[15.8e3, 16e3], [15.6e3], [16.2e3, 15.9e3, 15.7e3]]) {
        const reqs = Rs.map(wien);
        const raws = await session.run(reqs.map((r) => r.deck));
        for (const [i, r] of reqs.entries()) expect(vectors(raws[i]!)).toEqual(vectors(runNgspice(r.deck).raw));
      }
      expect(session.usable).toBe(true);
    } finally {
      session.close();
    }
  });

  it("ends itself after a member without its plot, and the executor runs that member alone for its error", async () => {
    const session = new NgspiceSession();
    const broken = simRequest({ title: "broken", params: {}, analysis: { kind: "op" }, circuit: "V1 a 0 1\nX1 a 0 nosuch" }); // no such subcircuit
    const raws = await session.run([wien(15.8e3).deck, broken.deck]);
    expect(raws[0]).not.toBeNull();
    expect(raws[1]).toBeNull();
    expect(session.usable).toBe(false);
    const executor = localExecutor({ cacheDir, noCache: true, concurrency: 1, keep: true });
    try {
      const outcomes = await executor.runMany([wien(15.8e3), broken, wien(16e3)]);
      expect(outcomes.map((o) => o.ok)).toEqual([true, false, true]);
      // The error is the one ngspice gives for the deck alone.
      let alone = "";
      try { runNgspice(broken.deck); } catch (e) { alone = (e as Error).message; }
      expect(alone).not.toBe("");
      expect(outcomes[1].ok === false && outcomes[1].error).toBe(alone);
      const after = await executor.runMany([wien(16e3)]);
      expect(vectors((after[0] as SimOutcome & { ok: true }).raw)).toEqual(vectors(runNgspice(wien(16e3).deck).raw));
    } finally {
      executor.close();
    }
  });

  it("ends once idle for the executor's keepIdleMs, and close() ends the rest", async () => {
    // A kept process is a shell (for its clean-up) running `ngspice -p`: count our children that are such shells.
    const kept = () => execFileSync("ps", ["-o", "args=", "--ppid", String(process.pid)], { encoding: "utf8" }).split("\n").filter((l) => /^sh -c ngspice -p\b/.test(l));
    const executor = localExecutor({ cacheDir, noCache: true, concurrency: 1, keep: true, keepIdleMs: 300 });
    await executor.runMany([wien(15.8e3), wien(16e3)]);
    expect(kept()).toHaveLength(1);
    await new Promise((r) => setTimeout(r, 1_000));
    expect(kept()).toHaveLength(0);
    const lasting = localExecutor({ cacheDir, noCache: true, concurrency: 1, keep: true });
    await lasting.runMany([wien(15.9e3)]);
    expect(kept()).toHaveLength(1);
    lasting.close();
    await new Promise((r) => setTimeout(r, 200)); // SIGKILL is sent; the kernel reaps it
    expect(kept()).toHaveLength(0);
  });

  it("removes its directory when its parent dies without closing it (a worker SIGKILLed)", async () => {
    const tmp = fs.mkdtempSync(path.join(os.tmpdir(), "assay-orphan-"));
    try {
      const deck = JSON.stringify(wien(15.8e3).deck);
      const child = spawn(process.execPath, ["--import", "tsx", "-e",
        `import("./checks/spice/session.ts").then(async ({ NgspiceSession }) => { const s = new NgspiceSession(); await s.run([${deck}]); console.log("ready"); setInterval(() => {}, 1000); });`],
      { cwd: process.cwd(), env: { ...process.env, TMPDIR: tmp }, stdio: ["ignore", "pipe", "inherit"] });
      await new Promise<void>((resolve, reject) => {
        child.stdout!.on("data", (d: Buffer) => { if (d.toString().includes("ready")) resolve(); });
        child.once("exit", (code) => reject(new Error(`exited ${code}`)));
      });
      const dirs = () => fs.readdirSync(tmp).filter((f) => f.startsWith("assay-spice-"));
      expect(dirs()).toHaveLength(1);
      child.kill("SIGKILL");
      const end = Date.now() + 5_000;
      while (dirs().length > 0 && Date.now() < end) await new Promise((r) => setTimeout(r, 50));
      expect(dirs()).toEqual([]);
    } finally {
      fs.rmSync(tmp, { recursive: true, force: true });
    }
  });

  it("is killed by the caller's abort, and a later batch gets a fresh process", async () => {
    const session = new NgspiceSession();
    const controller = new AbortController();
    // A transient long enough to be running when the abort comes.
    const slow = simRequest({ title: "slow", params: { R: 15.8e3, C: 10e-9 }, analysis: { kind: "tran", stop: 2, step: 1e-6, uic: true }, circuit: wien(15.8e3).circuit });
    const pending = session.run([slow.deck], 20_000, controller.signal);
    setTimeout(() => controller.abort(), 200);
    const t0 = performance.now();
    expect(await pending).toEqual([null]);
    expect(performance.now() - t0).toBeLessThan(5_000);
    expect(session.usable).toBe(false);
  });
});
