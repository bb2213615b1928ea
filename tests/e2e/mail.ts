import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";

const dir = () => process.env.MAIL_CATCHER_DIR ?? path.resolve(".run/test/mail");

/** Waits for the newest caught message to an address and returns the first link in it. */
export async function waitForMailLink(to: string, subjectPart: string, timeoutMs = 10_000): Promise<string> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    const files = readdirSync(dir()).filter((f) => f.endsWith(".json")).sort().reverse();
    for (const f of files) {
      const m = JSON.parse(readFileSync(path.join(dir(), f), "utf8")) as { to: string[]; subject: string; text: string };
      if (m.to.includes(to) && m.subject.includes(subjectPart)) {
        const link = m.text.match(/https?:\/\/\S+/)?.[0];
        if (link) return link;
      }
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`no mail to ${to} with "${subjectPart}" within ${timeoutMs} ms`);
}
