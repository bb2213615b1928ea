import "server-only";
import NextAuth, { CredentialsSignin } from "next-auth";
import Credentials from "next-auth/providers/credentials";
import { eq } from "drizzle-orm";
import bcrypt from "bcryptjs";
import { z } from "zod";
import { db } from "@/db/client";
import { sessions, users } from "@/db/schema";
import { env } from "./env";
import { consumeEmailToken } from "./email-tokens";
import { signInAttempt } from "./throttle";
import { clientAddress } from "./client-address";
import { audit } from "./audit";
import { log } from "./log";
import { isDatabaseUnavailable } from "./db-errors";

export const SESSION_DAYS = 7;

/** The code carries the wait, so the form can say "try again in N seconds". */
class RateLimited extends CredentialsSignin {
  constructor(seconds: number) {
    super();
    this.code = `rate_limited_${seconds}`;
  }
}
class BadCredentials extends CredentialsSignin {
  code = "bad_credentials";
}
class BadLink extends CredentialsSignin {
  code = "bad_link";
}
class DatabaseUnavailable extends CredentialsSignin {
  code = "unavailable";
}

/** A sign-in that fails because the database is away says so, instead of "wrong password" or "bad link". */
function withDatabaseErrors<C extends { authorize: (raw: Partial<Record<string, unknown>>, request: Request) => Promise<unknown> }>(config: C): C {
  const authorize = config.authorize;
  return {
    ...config,
    async authorize(raw: Partial<Record<string, unknown>>, request: Request) {
      try {
        return await authorize(raw, request);
      } catch (e) {
        if (isDatabaseUnavailable(e)) throw new DatabaseUnavailable();
        throw e;
      }
    },
  };
}

const passwordInput = z.object({ email: z.string().trim().toLowerCase().email(), password: z.string().min(1).max(200) });
const linkInput = z.object({ token: z.string().min(20).max(200) });

async function openSession(userId: string, request: Request): Promise<string> {
  const [row] = await db
    .insert(sessions)
    .values({
      userId,
      expiresAt: new Date(Date.now() + SESSION_DAYS * 86_400_000),
      userAgent: request.headers.get("user-agent")?.slice(0, 300) ?? null,
    })
    .returning({ id: sessions.id });
  return row.id;
}

export const { handlers, auth, signIn, signOut } = NextAuth({
  secret: env.AUTH_SECRET,
  trustHost: true,
  session: { strategy: "jwt", maxAge: SESSION_DAYS * 86_400 },
  pages: { signIn: "/signin" },
  // Auth.js logs through our structured logger; a refused sign-in is expected (and audited), not an error.
  logger: {
    error(error) {
      const kind = (error as Error & { type?: string }).type ?? error.name;
      if (kind === "CredentialsSignin") return;
      log("error", "auth error", { kind, error: error.message });
    },
    warn(code) {
      log("warn", "auth warning", { code });
    },
    debug() {},
  },
  providers: [
    Credentials(withDatabaseErrors({
      id: "password",
      name: "E-mail and password",
      credentials: { email: {}, password: {} },
      async authorize(raw, request) {
        const parsed = passwordInput.safeParse(raw);
        if (!parsed.success) throw new BadCredentials();
        const { email, password } = parsed.data;
        const client = clientAddress(request.headers);
        let user: typeof users.$inferSelect | undefined;
        const r = await signInAttempt(email, client, async () => {
          [user] = await db.select().from(users).where(eq(users.email, email)).limit(1);
          return !!user?.passwordHash && (await bcrypt.compare(password, user.passwordHash));
        });
        if (r.outcome === "wait") {
          await audit({ action: "auth.signin_failed", actorEmail: email, detail: { reason: "rate_limited", waitSeconds: r.seconds, client } });
          throw new RateLimited(r.seconds);
        }
        if (r.outcome === "bad" || !user) {
          await audit({ action: "auth.signin_failed", actorEmail: email, detail: { reason: "bad_credentials", client } });
          throw new BadCredentials();
        }
        const sid = await openSession(user.id, request);
        await audit({ action: "auth.signin", actorId: user.id, actorEmail: user.email, detail: { method: "password" } });
        return { id: user.id, email: user.email, name: user.name, sid };
      },
    })),
    Credentials(withDatabaseErrors({
      id: "link",
      name: "Sign-in link",
      credentials: { token: {} },
      async authorize(raw, request) {
        const parsed = linkInput.safeParse(raw);
        if (!parsed.success) throw new BadLink();
        const userId = await consumeEmailToken(parsed.data.token, "signin_link");
        if (!userId) throw new BadLink();
        const [user] = await db.select().from(users).where(eq(users.id, userId)).limit(1);
        if (!user) throw new BadLink();
        const sid = await openSession(user.id, request);
        await audit({ action: "auth.signin", actorId: user.id, actorEmail: user.email, detail: { method: "link" } });
        return { id: user.id, email: user.email, name: user.name, sid };
      },
    })),
  ],
  callbacks: {
    jwt({ token, user }) {
      if (user && "sid" in user) token.sid = (user as { sid: string }).sid;
      return token;
    },
    session({ session, token }) {
      return { ...session, sid: typeof token.sid === "string" ? token.sid : undefined };
    },
  },
  events: {
    async signOut(message) {
      const sid = "token" in message ? message.token?.sid : undefined;
      if (typeof sid === "string") await db.delete(sessions).where(eq(sessions.id, sid));
    },
  },
});
