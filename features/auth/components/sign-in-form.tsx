"use client";
import { useState } from "react";
import { signIn } from "next-auth/react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/form/field";
import { api, ApiError } from "@/lib/api-client";
import { signInMessage } from "../messages";

type Mode = "password" | "link" | "reset";

export function SignInForm() {
  const [mode, setMode] = useState<Mode>("password");
  const [email, setEmail] = useState("");
  const [password, setPassword] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setError(null);
    setNotice(null);
    setBusy(true);
    try {
      if (mode === "password") {
        const r = await signIn("password", { email, password, redirect: false });
        if (r?.error) setError(signInMessage(r.code));
        else window.location.assign("/");
      } else {
        const path = mode === "link" ? "/api/v1/auth/link" : "/api/v1/auth/reset-request";
        const r = await api<{ message: string }>(path, { method: "POST", json: { email } });
        setNotice(r.message);
      }
    } catch (err) {
      setError(err instanceof ApiError ? err.message : "Could not reach the server. Check your connection and try again.");
    } finally {
      setBusy(false);
    }
  }

  return (
    <form onSubmit={submit} className="flex flex-col gap-4" aria-label="Sign in">
      <h1 className="text-lg font-semibold">
        {mode === "password" ? "Sign in" : mode === "link" ? "E-mail me a sign-in link" : "Reset your password"}
      </h1>
      <Field id="email" label="E-mail" type="email" autoComplete="email" required value={email} onChange={(e) => setEmail(e.target.value)} />
      {mode === "password" ? (
        <Field
          id="password"
          label="Password"
          type="password"
          autoComplete="current-password"
          required
          value={password}
          onChange={(e) => setPassword(e.target.value)}
        />
      ) : null}
      {error ? (
        <p role="alert" className="rounded border border-danger/50 bg-danger/10 px-2 py-1.5 text-sm text-danger">
          ⚠ {error}
        </p>
      ) : null}
      {notice ? (
        <p role="status" className="rounded border border-ok/50 bg-ok/10 px-2 py-1.5 text-sm text-ok">
          ✓ {notice}
        </p>
      ) : null}
      <Button type="submit" variant="primary" disabled={busy}>
        {mode === "password" ? "Sign in" : mode === "link" ? "Send link" : "Send reset link"}
      </Button>
      <div className="flex justify-between text-xs">
        {mode !== "password" ? (
          <button type="button" className="text-accent underline" onClick={() => setMode("password")}>
            Sign in with password
          </button>
        ) : (
          <button type="button" className="text-accent underline" onClick={() => setMode("link")}>
            E-mail me a sign-in link
          </button>
        )}
        {mode !== "reset" ? (
          <button type="button" className="text-accent underline" onClick={() => setMode("reset")}>
            Forgot password?
          </button>
        ) : null}
      </div>
    </form>
  );
}
