import { z } from "zod";

/**
 * The one place that reads process.env. Everything else imports `env` from here, so a missing
 * or malformed setting fails at start with a message naming it.
 */
const schema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  /** The scripts export it with the app role's generated password; without one this default connects nowhere. */
  DATABASE_URL: z.string().url().default("postgres://rimeplan@127.0.0.1:54329/rimeplan"),
  AUTH_SECRET: z.string().min(16, "AUTH_SECRET must be at least 16 characters").optional(),
  APP_URL: z.string().url().default("http://localhost:3000"),
  SMTP_HOST: z.string().default("127.0.0.1"),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(2525),
  MAIL_FROM: z.string().default("Rimeplan <no-reply@rimeplan.invalid>"),
  /** Folder the fake SMTP server writes caught mail into; enables the dev mail page. */
  MAIL_CATCHER_DIR: z.string().optional(),
  /** "1" shows the caught-mail page (/dev/mail); never set it on a real deployment. */
  RIMEPLAN_DEV_MAIL: z.enum(["0", "1"]).default("0"),
  LOG_LEVEL: z.enum(["debug", "info", "warn", "error", "silent"]).default("info"),
  /**
   * Failed sign-ins from one client for one address (×4 for all addresses, ×10 for one address
   * from all clients) before each further attempt must wait; failures count for the window.
   * See lib/throttle.ts for the whole rule.
   */
  SIGNIN_MAX_ATTEMPTS: z.coerce.number().int().min(1).max(1000).default(5),
  /** How often an idle job worker asks the queue for work (seconds, ≥ 0.5); a new job also wakes it at once. */
  JOBS_POLL_SECONDS: z.coerce.number().min(0.5).max(60).default(2),
  /** Jobs one worker process runs at the same time, per kind of job. */
  JOBS_CONCURRENCY: z.coerce.number().int().min(1).max(16).default(1),
  SIGNIN_WINDOW_MINUTES: z.coerce.number().int().min(1).max(1440).default(15),
  /** The first required wait after the free failures; it doubles with each further failure, up to the window. */
  SIGNIN_WAIT_SECONDS: z.coerce.number().int().min(1).max(3600).default(30),
  /** Requests for sign-in and reset links (together) per address asked for, and per client, per window. */
  LINK_REQUESTS_PER_ADDRESS: z.coerce.number().int().min(1).max(1000).default(3),
  LINK_REQUESTS_PER_CLIENT: z.coerce.number().int().min(1).max(10000).default(10),
  LINK_REQUEST_WINDOW_MINUTES: z.coerce.number().int().min(1).max(1440).default(15),
  /** E-mails (one per recipient) people send from the app — scenario summaries, invitations — per user and per workspace per window. */
  MAIL_PER_USER: z.coerce.number().int().min(1).max(100000).default(50),
  MAIL_PER_WORKSPACE: z.coerce.number().int().min(1).max(1000000).default(200),
  MAIL_LIMIT_WINDOW_MINUTES: z.coerce.number().int().min(1).max(1440).default(60),
  /** Set by scripts/serve.ts for the app it serves (a secret per start); never set it by hand. */
  RIMEPLAN_SERVER_MARK: z.string().min(16).optional(),
  /** Proxies in front of scripts/serve.ts (0: none). Any proxy means a deployment: the caught-mail page is then off. */
  TRUST_PROXY: z.coerce.number().int().min(0).max(10).default(0),
});

export type Env = z.infer<typeof schema>;

function load(): Env {
  const parsed = schema.safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`).join("\n");
    throw new Error(`Invalid environment:\n${lines}`);
  }
  return parsed.data;
}

export const env: Env = load();
