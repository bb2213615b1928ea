"use client";
import { useParams, useRouter } from "next/navigation";

export function WorkspaceSwitcher({ workspaces }: { workspaces: { slug: string; name: string; role: string }[] }) {
  const params = useParams<{ ws?: string }>();
  const router = useRouter();
  if (workspaces.length === 0) return null;
  return (
    <label className="flex items-center gap-2 text-sm">
      <span className="sr-only">Workspace</span>
      <select
        aria-label="Workspace"
        className="rounded border border-line bg-surface px-2 py-1 text-sm"
        value={params.ws ?? ""}
        onChange={(e) => router.push(`/w/${e.target.value}`)}
      >
        {!params.ws ? <option value="">Choose a workspace…</option> : null}
        {workspaces.map((w) => (
          <option key={w.slug} value={w.slug}>
            {w.name} — {w.role}
          </option>
        ))}
      </select>
    </label>
  );
}
