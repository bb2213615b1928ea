import "server-only";
import nodemailer from "nodemailer";
import { env } from "./env";
import { log } from "./log";

// Loopback fake SMTP in development and tests; a real relay is configured by SMTP_HOST/PORT.
const transport = nodemailer.createTransport({
  host: env.SMTP_HOST,
  port: env.SMTP_PORT,
  secure: false,
  ignoreTLS: true,
});

export interface Mail {
  to: string;
  subject: string;
  text: string;
  html?: string;
}

export async function sendMail(mail: Mail): Promise<void> {
  await transport.sendMail({ from: env.MAIL_FROM, ...mail });
  log("info", "mail sent", { to: mail.to, subject: mail.subject });
}

/** Absolute link into the app for e-mails. */
export function appLink(pathAndQuery: string): string {
  return new URL(pathAndQuery, env.APP_URL).toString();
}
