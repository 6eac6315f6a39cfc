import nodemailer, { type Transporter } from "nodemailer";

// One transport per process. SMTP_URL names the server (npm start points it at the local sink).
const holder = globalThis as unknown as { __assayMailer?: { url: string; transport: Transporter } };

export function smtpUrl(): string {
  return process.env.SMTP_URL ?? `smtp://127.0.0.1:${process.env.LOCAL_SMTP_PORT ?? 2525}`;
}

export const mailFrom = (): string => process.env.MAIL_FROM ?? "Assay <assay@assay.test>";

function transport(): Transporter {
  const url = smtpUrl();
  if (holder.__assayMailer?.url !== url) {
    holder.__assayMailer = { url, transport: nodemailer.createTransport(url) };
  }
  return holder.__assayMailer.transport;
}

export interface Mail {
  to: string | string[];
  subject: string;
  text: string;
  html: string;
}

export async function sendMail(mail: Mail): Promise<void> {
  await transport().sendMail({ from: mailFrom(), ...mail });
}
