import { humanWait } from "@/lib/human-wait";

/** The sign-in form's words for a refusal code from lib/auth.ts; "rate_limited_N" carries the seconds to wait. */
export function signInMessage(code: string | undefined | null): string {
  const wait = /^rate_limited_(\d+)$/.exec(code ?? "");
  if (wait) return `Too many failed sign-ins from here for this address. Try again in ${humanWait(Number(wait[1]))}, or ask for a sign-in link.`;
  return "E-mail or password is wrong.";
}
