import "server-only";
import nodemailer from "nodemailer";
import { env } from "./env";
import { log } from "./log";
import { enqueue } from "./jobs/queue";

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

/**
 * Queues a mail (kind "mail.send"): the request answers at once, the worker delivers it, and a
 * relay that is away is retried with backoff (JOB_KINDS in lib/jobs/queue.ts). `workspaceId`
 * ties a workspace's mail to it.
 */
export async function sendMail(mail: Mail, meta: { workspaceId?: string | null; userId?: string | null } = {}): Promise<void> {
  const { job } = await enqueue({ kind: "mail.send", workspaceId: meta.workspaceId ?? null, createdBy: meta.userId ?? null, input: { ...mail }, stage: "Waiting to be sent" });
  log("info", "mail queued", { to: mail.to, subject: mail.subject, jobId: job.id });
}

/** Hands a mail to the SMTP relay now (the worker's "mail.send" handler). */
export async function deliverMail(mail: Mail): Promise<void> {
  await transport.sendMail({ from: env.MAIL_FROM, ...mail });
  log("info", "mail sent", { to: mail.to, subject: mail.subject });
}

/** Absolute link into the app for e-mails. */
export function appLink(pathAndQuery: string): string {
  return new URL(pathAndQuery, env.APP_URL).toString();
}
