import { randomBytes } from "node:crypto";
import { mkdirSync, writeFileSync, renameSync } from "node:fs";
import path from "node:path";
import { simpleParser, type AddressObject } from "mailparser";
import { SMTPServer } from "smtp-server";

// A local SMTP server that keeps every message as JSON on disk, so development and tests need no real mail.
export interface StoredMail {
  id: string;
  receivedAt: string;
  envelope: { from: string | null; to: string[] };
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
}

export interface MailSink {
  port: number;
  dir: string;
  close(): Promise<void>;
}

function addresses(a: AddressObject | AddressObject[] | undefined): string[] {
  const list = Array.isArray(a) ? a : a ? [a] : [];
  return list.flatMap((x) => x.value.map((v) => v.address ?? "")).filter(Boolean);
}

export function startMailSink({ port, dir }: { port: number; dir: string }): Promise<MailSink> {
  mkdirSync(dir, { recursive: true });
  const server = new SMTPServer({
    secure: false,
    authOptional: true,
    disabledCommands: ["STARTTLS", "AUTH"],
    size: 2 * 1024 * 1024,
    logger: false,
    onData(stream, session, done) {
      simpleParser(stream)
        .then((parsed) => {
          const receivedAt = new Date();
          const id = `${receivedAt.getTime()}-${randomBytes(4).toString("hex")}`;
          const mail: StoredMail = {
            id,
            receivedAt: receivedAt.toISOString(),
            envelope: {
              from: session.envelope.mailFrom ? session.envelope.mailFrom.address : null,
              to: session.envelope.rcptTo.map((r) => r.address),
            },
            from: parsed.from?.text ?? "",
            to: addresses(parsed.to),
            subject: parsed.subject ?? "",
            text: parsed.text ?? "",
            html: typeof parsed.html === "string" ? parsed.html : null,
          };
          // Written under a temporary name and renamed, so readers never see half a message.
          const file = path.join(dir, `${id}.json`);
          writeFileSync(`${file}.tmp`, JSON.stringify(mail, null, 2));
          renameSync(`${file}.tmp`, file);
          done();
        })
        .catch((err: Error) => done(err));
    },
  });
  return new Promise((resolve, reject) => {
    const onError = (err: Error) => reject(err);
    server.once("error", onError);
    server.listen(port, "127.0.0.1", () => {
      server.off("error", onError);
      const addr = server.server.address();
      const actual = typeof addr === "object" && addr ? addr.port : port;
      resolve({ port: actual, dir, close: () => new Promise<void>((r) => server.close(() => r())) });
    });
  });
}
