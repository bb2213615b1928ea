import { humanWait } from "@/lib/human-wait";

/** The sign-in form's words for a refusal code from lib/auth.ts; "rate_limited_N" carries the seconds to wait. */
export function signInMessage(code: string | undefined | null): string {
  const wait = /^rate_limited_(\d+)$/.exec(code ?? "");
  if (code === "unavailable")
    return "Rimeplan's database is not reachable right now, so nobody can sign in. Try again in a minute; if it keeps happening, tell whoever runs Rimeplan.";
  if (wait) return `Too many failed sign-ins from here for this address. Try again in ${humanWait(Number(wait[1]))}, or ask for a sign-in link.`;
  return "E-mail or password is wrong.";
}
