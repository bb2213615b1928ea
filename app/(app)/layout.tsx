import type { ReactNode } from "react";
import Link from "next/link";
import { requireUser } from "@/lib/session";
import { Brand } from "@/components/layout/brand";
import { CodeNotice } from "@/components/layout/code-notice";
import { UserMenu } from "@/features/account/components/user-menu";
import { WorkspaceSwitcher } from "@/features/team/components/workspace-switcher";
import { myWorkspaces } from "@/features/team/queries";

export default async function AppLayout({ children }: { children: ReactNode }) {
  const user = await requireUser();
  const workspaces = await myWorkspaces(user.id);
  return (
    <div className="flex min-h-screen flex-col">
      <header className="no-print flex h-11 items-center gap-4 border-b border-line bg-surface-2 px-4">
        <Link href="/" aria-label="Rimeplan home">
          <Brand />
        </Link>
        <WorkspaceSwitcher workspaces={workspaces.map((w) => ({ slug: w.slug, name: w.name, role: w.role }))} />
        <div className="ml-auto">
          <UserMenu name={user.name} email={user.email} unitSystem={user.unitSystem} theme={user.theme} />
        </div>
      </header>
      <div className="flex-1">{children}</div>
      <footer className="no-print border-t border-line px-4 py-2">
        <CodeNotice />
      </footer>
    </div>
  );
}
