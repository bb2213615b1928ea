"use client";
import { useState } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/form/field";
import { api, ApiError } from "@/lib/api-client";
import { ROLE_NAMES, ROLE_SUMMARY, type RoleName } from "../roles";
import type { InviteDto, MemberDto } from "../schema";

export function TeamPanel({ ws, canManage, myId }: { ws: string; canManage: boolean; myId: string }) {
  const qc = useQueryClient();
  const [email, setEmail] = useState("");
  const [role, setRole] = useState<RoleName>("designer");
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [msg, setMsg] = useState<{ ok: boolean; text: string } | null>(null);
  const q = useQuery({ queryKey: ["members", ws], queryFn: () => api<{ members: MemberDto[]; invites: InviteDto[] }>(`/api/v1/workspaces/${ws}/members`) });
  const refresh = () => qc.invalidateQueries({ queryKey: ["members", ws] });
  const fail = (e: unknown) => setMsg({ ok: false, text: e instanceof Error ? e.message : "Failed." });

  const invite = useMutation({
    mutationFn: () => api(`/api/v1/workspaces/${ws}/invites`, { method: "POST", json: { email, role } }),
    onSuccess: () => {
      setMsg({ ok: true, text: `Invitation sent to ${email} as ${role}.` });
      setEmail("");
      setErrors({});
      refresh();
    },
    onError: (e) => (e instanceof ApiError && e.field ? setErrors(e.fieldMap()) : fail(e)),
  });
  const change = useMutation({
    mutationFn: (v: { userId: string; role: RoleName }) => api(`/api/v1/workspaces/${ws}/members/${v.userId}`, { method: "PATCH", json: { role: v.role } }),
    onSuccess: () => { setMsg({ ok: true, text: "Role changed." }); refresh(); },
    onError: (e) => { fail(e); refresh(); },
  });
  const revoke = useMutation({
    mutationFn: (inviteId: string) => api(`/api/v1/workspaces/${ws}/invites/${inviteId}`, { method: "DELETE" }),
    onSuccess: () => { setMsg({ ok: true, text: "Invitation revoked; its link no longer works." }); refresh(); },
    onError: fail,
  });
  const remove = useMutation({
    mutationFn: (userId: string) => api(`/api/v1/workspaces/${ws}/members/${userId}`, { method: "DELETE" }),
    onSuccess: () => { setMsg({ ok: true, text: "Member removed; their sessions ended." }); refresh(); },
    onError: fail,
  });

  return (
    <main className="flex max-w-4xl flex-col gap-5 p-4">
      {msg ? (
        <p role={msg.ok ? "status" : "alert"} className={`text-sm ${msg.ok ? "text-ok" : "text-danger"}`}>
          {msg.ok ? "✓" : "⚠"} {msg.text}
        </p>
      ) : null}
      <section aria-label="Members">
        <h2 className="mb-2 text-sm font-semibold">Members</h2>
        {q.isPending ? (
          <div className="h-24 animate-pulse rounded bg-surface-3" aria-busy="true" />
        ) : (
          <table className="w-full text-sm">
            <thead>
              <tr className="border-b border-line text-left text-xs text-muted">
                <th className="py-1.5 font-medium">Name</th>
                <th className="py-1.5 font-medium">E-mail</th>
                <th className="py-1.5 font-medium">Role</th>
                <th className="py-1.5"><span className="sr-only">Actions</span></th>
              </tr>
            </thead>
            <tbody>
              {q.data?.members.map((m) => (
                <tr key={m.userId} className="border-b border-line/60">
                  <td className="py-1.5">{m.name}{m.userId === myId ? <span className="text-xs text-muted"> (you)</span> : null}</td>
                  <td className="py-1.5 text-muted">{m.email}</td>
                  <td className="py-1.5">
                    {canManage ? (
                      <select aria-label={`Role of ${m.email}`} className="rounded border border-line bg-surface px-1.5 py-0.5" value={m.role} onChange={(e) => change.mutate({ userId: m.userId, role: e.target.value as RoleName })}>
                        {ROLE_NAMES.map((r) => <option key={r} value={r}>{r}</option>)}
                      </select>
                    ) : (
                      m.role
                    )}
                  </td>
                  <td className="py-1.5 text-right">
                    {canManage ? <Button variant="danger" onClick={() => { if (window.confirm(`Remove ${m.email} from this workspace? Their sessions end at once.`)) remove.mutate(m.userId); }} aria-label={`Remove ${m.email}`}>Remove</Button> : null}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>
      {canManage ? (
        <section aria-label="Invite" className="rounded border border-line bg-surface-2 p-4">
          <h2 className="mb-3 text-sm font-semibold">Invite by e-mail</h2>
          <form className="flex flex-wrap items-end gap-3" onSubmit={(e) => { e.preventDefault(); invite.mutate(); }}>
            <div className="min-w-64 flex-1">
              <Field id="invite-email" label="E-mail" type="email" value={email} onChange={(e) => setEmail(e.target.value)} error={errors.email} />
            </div>
            <label className="flex flex-col gap-1 text-xs font-medium text-muted">
              Role
              <select className="rounded border border-line bg-surface px-2 py-1.5 text-sm text-ink" value={role} onChange={(e) => setRole(e.target.value as RoleName)}>
                {ROLE_NAMES.map((r) => <option key={r} value={r}>{r}</option>)}
              </select>
            </label>
            <Button type="submit" variant="primary" disabled={invite.isPending}>Send invitation</Button>
          </form>
          <p className="mt-2 text-xs text-muted">{ROLE_SUMMARY[role]}.</p>
          {q.data?.invites.length ? (
            <div className="mt-3">
              <h3 className="text-xs font-semibold text-muted">Pending invitations</h3>
              <ul className="text-sm">
                {q.data.invites.map((i) => (
                  <li key={i.id} className="flex items-center gap-2">
                    {i.email} — {i.role}, expires {new Date(i.expiresAt).toLocaleDateString("en-GB")}
                    <Button variant="ghost" onClick={() => revoke.mutate(i.id)} aria-label={`Revoke the invitation to ${i.email}`}>Revoke</Button>
                  </li>
                ))}
              </ul>
            </div>
          ) : null}
        </section>
      ) : null}
      <section aria-label="Roles" className="text-xs text-muted">
        <h2 className="mb-1 text-sm font-semibold text-ink">What each role may do</h2>
        <ul>
          {ROLE_NAMES.map((r) => <li key={r}><strong className="text-ink">{r}</strong>: {ROLE_SUMMARY[r]}</li>)}
        </ul>
      </section>
    </main>
  );
}
