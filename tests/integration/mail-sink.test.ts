import { afterAll, describe, expect, it } from "vitest";
import { spawnSync } from "node:child_process";
import { mkdtempSync, readdirSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import nodemailer from "nodemailer";
import { readSink } from "@/lib/mail/mailbox";
import { startMailSink } from "@/lib/mail/sink";
import { freePort } from "../support/pg-cluster";

const dir = mkdtempSync(path.join(os.tmpdir(), "assay-sink-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe("local mail sink", () => {
  it("stores each message as JSON with its text and HTML parts", async () => {
    const sink = await startMailSink({ port: await freePort(), dir });
    try {
      const t = nodemailer.createTransport(`smtp://127.0.0.1:${sink.port}`);
      await t.sendMail({ from: "Assay <assay@assay.test>", to: "iris.calder@fenwick.test", subject: "Ünïcode subject", text: "plain body", html: "<p>html body</p>" });
      const files = readdirSync(dir);
      expect(files.filter((f) => f.endsWith(".json"))).toHaveLength(1);
      expect(files.some((f) => f.endsWith(".tmp"))).toBe(false);
      const [m] = readSink(dir);
      expect(m).toMatchObject({
        envelope: { from: "assay@assay.test", to: ["iris.calder@fenwick.test"] },
        to: ["iris.calder@fenwick.test"],
        subject: "Ünïcode subject",
        text: "plain body",
        html: "<p>html body</p>",
      });
    } finally {
      await sink.close();
    }
  });

  it("the CLI says in one line that the port is taken and exits 1", async () => {
    const sink = await startMailSink({ port: await freePort(), dir });
    try {
      const r = spawnSync(process.execPath, ["--import", "tsx", "lib/mail/sink-main.ts"], {
        encoding: "utf8",
        env: { ...process.env, LOCAL_SMTP_PORT: String(sink.port), ASSAY_MAIL_SINK_DIR: dir },
        timeout: 30_000,
      });
      expect(r.status).toBe(1);
      expect(r.stdout).toBe("");
      expect(r.stderr.trim().split("\n")).toEqual([`[assay] mail sink: port ${sink.port} is already in use (set LOCAL_SMTP_PORT)`]);
    } finally {
      await sink.close();
    }
  });
});
