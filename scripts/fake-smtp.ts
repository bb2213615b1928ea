/**
 * Local fake SMTP server for development and tests: accepts every message on loopback and
 * writes it as JSON into MAIL_CATCHER_DIR, where the dev mail page and the tests read it.
 */
import { SMTPServer } from "smtp-server";
import { simpleParser } from "mailparser";
import { mkdirSync, writeFileSync } from "node:fs";
import path from "node:path";
import { randomUUID } from "node:crypto";

const port = Number(process.env.SMTP_PORT ?? 2525);
const dir = process.env.MAIL_CATCHER_DIR ?? path.resolve(".run/mail");
mkdirSync(dir, { recursive: true });

const server = new SMTPServer({
  authOptional: true,
  disabledCommands: ["STARTTLS", "AUTH"],
  logger: false,
  onData(stream, session, callback) {
    const chunks: Buffer[] = [];
    stream.on("data", (c: Buffer) => chunks.push(c));
    stream.on("end", async () => {
      const raw = Buffer.concat(chunks);
      const parsed = await simpleParser(raw);
      const msg = {
        id: randomUUID(),
        receivedAt: new Date().toISOString(),
        from: session.envelope.mailFrom ? session.envelope.mailFrom.address : "",
        to: session.envelope.rcptTo.map((r) => r.address),
        subject: parsed.subject ?? "",
        text: parsed.text ?? "",
        html: typeof parsed.html === "string" ? parsed.html : "",
      };
      writeFileSync(path.join(dir, `${Date.now()}-${msg.id}.json`), JSON.stringify(msg, null, 2));
      callback();
    });
  },
});
server.listen(port, "127.0.0.1", () => {
  if (process.env.SMTP_PID_FILE) writeFileSync(process.env.SMTP_PID_FILE, String(process.pid));
  console.log(`fake SMTP listening on 127.0.0.1:${port}, writing to ${dir}`);
});
