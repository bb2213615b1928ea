import { readdir, readFile } from "node:fs/promises";
import path from "node:path";
import { headers } from "next/headers";
import { notFound } from "next/navigation";
import { env } from "@/lib/env";
import { devMailShown } from "@/lib/dev-mail";

export const dynamic = "force-dynamic";

async function shown(): Promise<boolean> {
  const settings = { flag: env.RIMEPLAN_DEV_MAIL, catcherDir: env.MAIL_CATCHER_DIR, appUrl: env.APP_URL, trustProxy: env.TRUST_PROXY };
  return devMailShown(settings, await headers());
}

/** Refused, the page is a plain 404 down to its title: nothing says there is a page here. */
export async function generateMetadata() {
  return (await shown()) ? { title: "Caught e-mail (development)" } : {};
}

interface Caught {
  id: string;
  receivedAt: string;
  to: string[];
  subject: string;
  text: string;
}

function linkify(text: string) {
  return text.split(/(https?:\/\/\S+)/g).map((part, i) =>
    /^https?:\/\//.test(part) ? (
      <a key={i} href={part} className="text-accent underline break-all">
        {part}
      </a>
    ) : (
      <span key={i}>{part}</span>
    ),
  );
}

/** Development only: the messages the local fake SMTP server caught, newest first (see lib/dev-mail.ts for who may see it). */
export default async function DevMail() {
  if (!(await shown()) || !env.MAIL_CATCHER_DIR) notFound();
  const dir = env.MAIL_CATCHER_DIR;
  const files = (await readdir(dir).catch(() => [])).filter((f) => f.endsWith(".json")).sort().reverse().slice(0, 100);
  const mails: Caught[] = await Promise.all(files.map(async (f) => JSON.parse(await readFile(path.join(dir, f), "utf8")) as Caught));
  return (
    <main className="mx-auto max-w-3xl p-6">
      <h1 className="text-lg font-semibold">Caught e-mail</h1>
      <p className="mb-4 text-xs text-muted">Development only. Messages sent by this app to the local fake SMTP server ({dir}).</p>
      {mails.length === 0 ? <p className="text-sm text-muted">No messages yet.</p> : null}
      <ol className="flex flex-col gap-3">
        {mails.map((m) => (
          <li key={m.id} className="rounded border border-line p-3" data-testid="mail">
            <div className="text-xs text-muted">
              {m.receivedAt} · to {m.to.join(", ")}
            </div>
            <div className="font-medium">{m.subject}</div>
            <pre className="mt-2 whitespace-pre-wrap font-sans text-sm">{linkify(m.text)}</pre>
          </li>
        ))}
      </ol>
    </main>
  );
}
