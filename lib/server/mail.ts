import nodemailer from "nodemailer";
import { startMailFake } from "./mail-fake";

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
}

export function mailFrom(): string {
  return process.env.MAIL_FROM || "Coatwright <coatwright@localhost>";
}

async function transport() {
  if (process.env.SMTP_URL) return nodemailer.createTransport(process.env.SMTP_URL);
  const { port } = await startMailFake();
  return nodemailer.createTransport({ host: "127.0.0.1", port, secure: false, ignoreTLS: true });
}

export async function sendMail(mail: OutgoingMail): Promise<void> {
  const t = await transport();
  await t.sendMail({ from: mailFrom(), ...mail });
}

/** The public address links in e-mails point to. */
export function appUrl(request?: Request): string {
  if (process.env.APP_URL) return process.env.APP_URL.replace(/\/$/, "");
  if (request) return new URL(request.url).origin;
  return "http://127.0.0.1:3000";
}
