import { describe, expect, it } from "vitest";
import { randomUUID } from "node:crypto";
import { and, count, eq, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { throttleEvents } from "@/db/schema";
import { env } from "@/lib/env";
import { AppError } from "@/lib/errors";
import { signInAttempt, take, takeLinkRequest, takeMail } from "@/lib/throttle";

const addr = () => `${randomUUID().slice(0, 8)}@example.test`;
/** A client of its own for each call (the key is whatever clientAddress() answered). */
const client = () => `client-${randomUUID()}`;

const right = async () => true;
const wrong = async () => false;

/** Moves every event of a key back in time, as if `seconds` had passed. */
async function age(key: string, seconds: number) {
  await db.execute(sql`update throttle_events set at = at - make_interval(secs => ${seconds}) where key = ${key} or key like ${`%|${key}`} or key like ${`${key}|%`}`);
}

async function events(bucket: string, key: string) {
  const [r] = await db.select({ n: count() }).from(throttleEvents).where(and(eq(throttleEvents.bucket, bucket), eq(throttleEvents.key, key)));
  return r.n;
}

async function refusal(p: Promise<unknown>): Promise<AppError> {
  try {
    await p;
  } catch (e) {
    if (e instanceof AppError) return e;
    throw e;
  }
  throw new Error("expected a refusal");
}

describe("sign-in limits: slow down a client, never lock the real person out", () => {
  it("a stranger's failures from another client do not stop the real person signing in from theirs", async () => {
    const email = addr();
    const stranger = client();
    const real = client();
    const outcomes = [];
    for (let i = 0; i < env.SIGNIN_MAX_ATTEMPTS + 3; i++) outcomes.push((await signInAttempt(email, stranger, wrong)).outcome);
    expect(outcomes.slice(0, env.SIGNIN_MAX_ATTEMPTS).every((o) => o === "bad")).toBe(true);
    expect(outcomes.slice(env.SIGNIN_MAX_ATTEMPTS)).toEqual(["wait", "wait", "wait"]);
    expect(await signInAttempt(email, real, right)).toEqual({ outcome: "ok" });
    // and the real person's own typos are counted apart from the stranger's
    expect((await signInAttempt(email, real, wrong)).outcome).toBe("bad");
  });

  it("one client's repeated failures need a growing wait, stated in seconds; a success clears them", async () => {
    const email = addr();
    const c = client();
    for (let i = 0; i < env.SIGNIN_MAX_ATTEMPTS; i++) expect((await signInAttempt(email, c, wrong)).outcome).toBe("bad");
    let checked = false;
    const first = await signInAttempt(email, c, async () => (checked = true));
    expect(first.outcome).toBe("wait");
    expect(checked).toBe(false); // the password is not even looked at while waiting
    const w1 = (first as { seconds: number }).seconds;
    expect(w1).toBeGreaterThan(env.SIGNIN_WAIT_SECONDS - 3);
    expect(w1).toBeLessThanOrEqual(env.SIGNIN_WAIT_SECONDS);

    await age(c, env.SIGNIN_WAIT_SECONDS + 1);
    expect((await signInAttempt(email, c, wrong)).outcome).toBe("bad");
    const second = await signInAttempt(email, c, right);
    expect(second.outcome).toBe("wait");
    const w2 = (second as { seconds: number }).seconds;
    expect(w2).toBeGreaterThan(2 * env.SIGNIN_WAIT_SECONDS - 3); // doubled
    expect(w2).toBeLessThanOrEqual(2 * env.SIGNIN_WAIT_SECONDS);

    await age(c, 2 * env.SIGNIN_WAIT_SECONDS + 1);
    expect(await signInAttempt(email, c, right)).toEqual({ outcome: "ok" });
    expect(await events("signin.fail", `${email}|${c}`)).toBe(0);
    // a fresh allowance after the success
    for (let i = 0; i < env.SIGNIN_MAX_ATTEMPTS; i++) expect((await signInAttempt(email, c, wrong)).outcome).toBe("bad");
  });

  it("failures older than the window no longer count", async () => {
    const email = addr();
    const c = client();
    for (let i = 0; i < env.SIGNIN_MAX_ATTEMPTS; i++) await signInAttempt(email, c, wrong);
    expect((await signInAttempt(email, c, wrong)).outcome).toBe("wait");
    await age(c, env.SIGNIN_WINDOW_MINUTES * 60 + 1);
    expect((await signInAttempt(email, c, wrong)).outcome).toBe("bad");
  });

  it("one client guessing across many addresses is slowed after four times the allowance", async () => {
    const c = client();
    for (let i = 0; i < env.SIGNIN_MAX_ATTEMPTS * 4; i++) expect((await signInAttempt(addr(), c, wrong)).outcome).toBe("bad");
    expect((await signInAttempt(addr(), c, right)).outcome).toBe("wait");
    // another client is not affected
    expect((await signInAttempt(addr(), client(), right)).outcome).toBe("ok");
  });

  it("guesses at one address spread over many clients are slowed, except for a client that signed in there before", async () => {
    const email = addr();
    const home = client();
    expect((await signInAttempt(email, home, right)).outcome).toBe("ok");
    for (let i = 0; i < env.SIGNIN_MAX_ATTEMPTS * 10; i++) expect((await signInAttempt(email, client(), wrong)).outcome).toBe("bad");
    expect((await signInAttempt(email, client(), right)).outcome).toBe("wait");
    expect((await signInAttempt(email, home, right)).outcome).toBe("ok");
  });

  it("a burst of parallel guesses from one client is counted one by one", async () => {
    const email = addr();
    const c = client();
    let looked = 0;
    const r = await Promise.all(
      Array.from({ length: env.SIGNIN_MAX_ATTEMPTS + 5 }, () =>
        signInAttempt(email, c, async () => {
          looked++;
          return false;
        }),
      ),
    );
    expect(looked).toBe(env.SIGNIN_MAX_ATTEMPTS);
    expect(r.filter((x) => x.outcome === "wait")).toHaveLength(5);
  });
});

describe("link and reset requests are throttled per address and per client", () => {
  it("refuses the address after the allowance, the same whether or not it has an account, saying when", async () => {
    const email = addr(); // no account
    for (let i = 0; i < env.LINK_REQUESTS_PER_ADDRESS; i++) await takeLinkRequest(email, client());
    const e = await refusal(takeLinkRequest(email, client()));
    expect(e.code).toBe("rate_limited");
    expect(e.status).toBe(429);
    expect(e.message).toContain("for this address");
    expect(e.message).toMatch(new RegExp(`Try again in (${env.LINK_REQUEST_WINDOW_MINUTES}|${env.LINK_REQUEST_WINDOW_MINUTES - 1}) minutes`));
    expect(e.extra?.retryAfterSeconds).toBeGreaterThan(env.LINK_REQUEST_WINDOW_MINUTES * 60 - 5);
    // once the window has passed, the address may ask again
    await age(email, env.LINK_REQUEST_WINDOW_MINUTES * 60 + 1);
    await takeLinkRequest(email, client());
  });

  it("refuses a client asking for many addresses", async () => {
    const c = client();
    for (let i = 0; i < env.LINK_REQUESTS_PER_CLIENT; i++) await takeLinkRequest(addr(), c);
    const e = await refusal(takeLinkRequest(addr(), c));
    expect(e.code).toBe("rate_limited");
    expect(e.message).toContain("from here");
    // another client, another address: fine
    await takeLinkRequest(addr(), client());
  });
});

describe("e-mails people send are limited per user and per workspace", () => {
  it("refuses a batch that would pass the sender's limit, all or nothing, and says when to try again", async () => {
    const user = randomUUID();
    const ws = randomUUID();
    await takeMail(user, ws, env.MAIL_PER_USER - 3);
    const e = await refusal(takeMail(user, ws, 10));
    expect(e.status).toBe(429);
    expect(e.message).toContain(`you can send at most ${env.MAIL_PER_USER} e-mails per hour`);
    expect(e.message).toContain("Nothing was sent");
    expect(e.message).toMatch(/Try again in (60|59) minutes/);
    expect(await events("mail.user", user)).toBe(env.MAIL_PER_USER - 3);
    await takeMail(user, ws, 3);
    expect((await refusal(takeMail(user, ws, 1))).code).toBe("rate_limited");
    await age(user, env.MAIL_LIMIT_WINDOW_MINUTES * 60 + 1);
    await takeMail(user, ws, 1);
  });

  it("counts every sender of a workspace together", async () => {
    const ws = randomUUID();
    const perSender = Math.min(env.MAIL_PER_USER, 10);
    let sent = 0;
    while (sent + perSender <= env.MAIL_PER_WORKSPACE) {
      await takeMail(randomUUID(), ws, perSender);
      sent += perSender;
    }
    const fresh = randomUUID();
    const e = await refusal(takeMail(fresh, ws, env.MAIL_PER_WORKSPACE - sent + 1));
    expect(e.message).toContain(`this workspace can send at most ${env.MAIL_PER_WORKSPACE} e-mails`);
    expect(await events("mail.user", fresh)).toBe(0);
    // another workspace is not affected
    await takeMail(fresh, randomUUID(), 1);
  });

  it("a batch larger than the whole limit is refused as such, naming the recipients", async () => {
    const e = await refusal(takeMail(randomUUID(), randomUUID(), env.MAIL_PER_USER + 1));
    expect(e.status).toBe(429);
    expect(e.field).toBe("to");
    expect(e.message).toBe(`E-mail limit: you can send at most ${env.MAIL_PER_USER} e-mails per hour; send to fewer recipients.`);
  });

  it("parallel requests never pass the cap", async () => {
    const user = randomUUID();
    const r = await Promise.allSettled(Array.from({ length: 12 }, () => takeMail(user, randomUUID(), Math.ceil(env.MAIL_PER_USER / 10))));
    const ok = r.filter((x) => x.status === "fulfilled").length;
    expect(ok * Math.ceil(env.MAIL_PER_USER / 10)).toBeLessThanOrEqual(env.MAIL_PER_USER);
    expect(await events("mail.user", user)).toBe(ok * Math.ceil(env.MAIL_PER_USER / 10));
    expect(ok).toBe(Math.floor(env.MAIL_PER_USER / Math.ceil(env.MAIL_PER_USER / 10)));
  });

  it("a cap larger than one request can ever fit is refused with the whole window", async () => {
    const t = await take([{ kind: "cap", bucket: "test.cap", key: randomUUID(), max: 2, windowSeconds: 600 }], 3);
    expect(t).toMatchObject({ ok: false, retryAfterSeconds: 600 });
  });
});
