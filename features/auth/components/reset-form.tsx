"use client";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/form/field";
import { api, ApiError } from "@/lib/api-client";

export function ResetForm({ token }: { token: string }) {
  const [password, setPassword] = useState("");
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [done, setDone] = useState(false);
  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setErrors({});
    try {
      await api("/api/v1/auth/reset", { method: "POST", json: { token, password } });
      setDone(true);
    } catch (err) {
      setErrors(err instanceof ApiError ? err.fieldMap() : { password: "Could not reach the server." });
    }
  }
  if (done)
    return (
      <div className="flex flex-col gap-3">
        <p role="status" className="text-sm text-ok">✓ Password changed. You were signed out everywhere.</p>
        <a className="text-sm text-accent underline" href="/signin">Sign in</a>
      </div>
    );
  return (
    <form onSubmit={submit} className="flex flex-col gap-4">
      <h1 className="text-lg font-semibold">Choose a new password</h1>
      <Field id="password" label="New password" type="password" autoComplete="new-password" hint="At least 10 characters"
        value={password} onChange={(e) => setPassword(e.target.value)} error={errors.password} />
      {errors.token ? <p role="alert" className="text-sm text-danger">⚠ {errors.token}</p> : null}
      <Button type="submit" variant="primary">Set password</Button>
    </form>
  );
}
