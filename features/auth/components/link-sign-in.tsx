"use client";
import { useState } from "react";
import { signIn } from "next-auth/react";
import { Button } from "@/components/ui/button";

/** A sign-in link is used by an explicit click, so mail scanners that fetch links cannot spend it. */
export function LinkSignIn({ token }: { token: string }) {
  const [error, setError] = useState<string | null>(token ? null : "This link is incomplete. Ask for a new one.");
  const [busy, setBusy] = useState(false);
  async function go() {
    setBusy(true);
    const r = await signIn("link", { token, redirect: false });
    setBusy(false);
    if (r?.error && r.code === "unavailable") setError("Rimeplan's database is not reachable right now. Try again in a minute; if the link has expired by then, ask for a new one from the sign-in page.");
    else if (r?.error) setError("This sign-in link is invalid, used or expired. Ask for a new one from the sign-in page.");
    else window.location.assign("/");
  }
  return (
    <div className="flex flex-col gap-4">
      <h1 className="text-lg font-semibold">Sign in with your link</h1>
      {error ? (
        <p role="alert" className="text-sm text-danger">
          ⚠ {error}
        </p>
      ) : null}
      <Button variant="primary" onClick={go} disabled={busy || !token}>
        Continue to Rimeplan
      </Button>
      <a href="/signin" className="text-xs text-accent underline">
        Back to sign-in
      </a>
    </div>
  );
}
