import type { ReactNode } from "react";
import { pageAccess } from "@/lib/page-access";
import { can } from "@/lib/authz";
import { NavTabs } from "@/components/layout/nav-tabs";

export default async function WorkspaceLayout({ children, params }: LayoutProps<"/w/[ws]">) {
  const { ws } = await params;
  const a = await pageAccess(ws, "workspace.read");
  if (!a.ok) return <>{children}</>;
  const tabs = [
    { href: `/w/${ws}`, label: "Facilities", exact: true },
    { href: `/w/${ws}/team`, label: "Team" },
    { href: `/w/${ws}/settings`, label: "Settings" },
    ...(can(a.access.role, "audit.read") ? [{ href: `/w/${ws}/audit`, label: "Audit log" }] : []),
  ];
  return (
    <div>
      <div className="flex items-baseline gap-3 px-4 pt-3">
        <h1 className="text-base font-semibold">{a.access.workspace.name}</h1>
        <span className="text-xs text-muted">your role: {a.access.role}</span>
      </div>
      <NavTabs tabs={tabs} label="Workspace" />
      {children as ReactNode}
    </div>
  );
}
