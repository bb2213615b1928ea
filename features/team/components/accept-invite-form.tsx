"use client";
import { useState } from "react";
import { signIn } from "next-auth/react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/form/field";
import { api, ApiError } from "@/lib/api-client";

export function AcceptInviteForm(props: { token: string; email: string; role: string; workspace: string; hasAccount: boolean }) {
  const [name, setName] = useState("");
  const [password, setPassword] = useState("");
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [busy, setBusy] = useState(false);

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setErrors({});
    setBusy(true);
    try {
      const r = await api<{ workspace: string }>("/api/v1/invites/accept", {
        method: "POST",
        json: { token: props.token, password, ...(props.hasAccount ? {} : { name }) },
      });
      const s = await signIn("password", { email: props.email, password, redirect: false });
      window.location.assign(s?.error ? "/signin" : `/w/${r.workspace}`);
    } catch (err) {
      setErrors(err instanceof ApiError ? err.fieldMap() : { password: "Could not reach the server." });
      setBusy(false);
    }
  }

  return (
    <form onSubmit={submit} className="flex flex-col gap-4">
      <h1 className="text-lg font-semibold">Join {props.workspace}</h1>
      <p className="text-sm text-muted">
        You were invited as <strong className="text-ink">{props.role}</strong> with the address{" "}
        <strong className="text-ink">{props.email}</strong>.
      </p>
      {!props.hasAccount ? (
        <Field id="name" label="Your name" autoComplete="name" value={name} onChange={(e) => setName(e.target.value)} error={errors.name} />
      ) : null}
      <Field
        id="password"
        label={props.hasAccount ? "Password of your existing account" : "Choose a password"}
        type="password"
        autoComplete={props.hasAccount ? "current-password" : "new-password"}
        hint={props.hasAccount ? undefined : "At least 10 characters"}
        value={password}
        onChange={(e) => setPassword(e.target.value)}
        error={errors.password}
      />
      {errors.token ? <p role="alert" className="text-sm text-danger">⚠ {errors.token}</p> : null}
      <Button type="submit" variant="primary" disabled={busy}>
        Accept and join
      </Button>
    </form>
  );
}
